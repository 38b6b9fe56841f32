import { ALIAS_CODE_LABELS, isOneYearWarning, ONE_YEAR_ADVICE, parseAliasWarning } from '../lib/alias-warnings';

/** The one-year text without the advice (which is drawn in bold after it). */
function oneYearDetail(text: string): string {
  const at = text.indexOf(ONE_YEAR_ADVICE);
  return (at >= 0 ? text.slice(0, at) : text).replace(/[\s:—-]+$/, '');
}

/**
 * A peak's alias warnings as a list, each led by a "⚠" and its kind in words. A peak near one
 * year carries the advice to fit the astrometry first, in bold.
 */
export function AliasWarningList({ warnings }: { warnings: readonly string[] }) {
  if (warnings.length === 0) return <p className="text-xs text-night-400">No alias warning for this peak.</p>;
  return (
    <ul aria-label="Alias warnings" className="flex flex-col gap-1.5 text-sm">
      {warnings.map((raw) => {
        const warning = parseAliasWarning(raw);
        const oneYear = isOneYearWarning(warning);
        return (
          <li key={raw} className="rounded-md border border-ember-500/50 bg-ember-500/10 px-3 py-2 text-night-100">
            <span aria-hidden="true" className="mr-1.5 text-ember-300">
              ⚠
            </span>
            <span className="font-semibold text-ember-200">{ALIAS_CODE_LABELS[warning.code] ?? 'Warning'}:</span>{' '}
            {oneYear ? (
              <>
                {oneYearDetail(warning.text)}: <strong className="font-semibold">{ONE_YEAR_ADVICE}</strong>
              </>
            ) : (
              warning.text
            )}
          </li>
        );
      })}
    </ul>
  );
}

import type { ComparisonWarning, ComparisonWarningCode, FitComparison } from '../../../../api/contracts/comparisons';
import { Alert } from '../../../components/alert';

const WARNING_TITLES: Record<ComparisonWarningCode, string> = {
  'settings-differ': 'Engine settings differ',
  'toas-differ': 'Different TOAs were fitted',
  'weights-differ': 'TOA weights differ',
  'not-nested': 'No F-test for a nested-looking pair',
  'not-converged': 'A fit did not converge',
  'fit-warnings': 'A fit reported warnings',
};

function WarningItem({ warning }: { warning: ComparisonWarning }) {
  return (
    <li>
      <span className="font-semibold">{WARNING_TITLES[warning.code] ?? warning.code}</span>
      {warning.fitRunIds.length > 0 ? <span> (runs {warning.fitRunIds.map((id) => `#${id}`).join(', ')})</span> : null}: {warning.message}
    </li>
  );
}

/** Each run's own fit warnings, which the `fit-warnings` entry only points to. */
function RunWarnings({ comparison }: { comparison: FitComparison }) {
  const withWarnings = comparison.runs.filter((r) => r.warnings.length > 0);
  if (withWarnings.length === 0) return null;
  return (
    <div className="mt-2">
      <p className="font-semibold">Warnings of the fits</p>
      <ul className="mt-1 list-disc space-y-1 pl-5">
        {withWarnings.map((run) => (
          <li key={run.fitRunId}>
            Run #{run.fitRunId}: {run.warnings.join('; ')}
          </li>
        ))}
      </ul>
    </div>
  );
}

/**
 * The API's warnings at the top of the comparison: an alert saying χ², AIC, BIC and F-tests are not
 * comparable when the runs fitted other TOAs or used other settings, then every warning in full.
 */
export function ComparisonWarnings({ comparison }: { comparison: FitComparison }) {
  if (comparison.statisticsComparable && comparison.warnings.length === 0) {
    return (
      <Alert tone="success" title="Statistics are comparable">
        All runs fitted the same TOAs with the same engine settings, so χ², AIC, BIC and the F-test can be compared directly.
      </Alert>
    );
  }
  return (
    <Alert tone="error" title={comparison.statisticsComparable ? 'Read the warnings before comparing' : 'Statistics are not comparable across these runs'}>
      {!comparison.statisticsComparable ? (
        <p>
          The runs fitted {comparison.sameToas ? 'the same TOAs' : 'different TOAs'} with{' '}
          {comparison.sameSettings ? 'the same engine settings' : 'different engine settings'}
          {comparison.differingSettings.length > 0 ? ` (${comparison.differingSettings.join(', ')})` : ''}. χ², AIC and BIC are shown
          for each run on its own; no run is marked lowest and no F-test is made.
        </p>
      ) : null}
      {comparison.warnings.length > 0 ? (
        <ul className="mt-2 list-disc space-y-1 pl-5">
          {comparison.warnings.map((w, i) => (
            <WarningItem key={`${w.code}-${i}`} warning={w} />
          ))}
        </ul>
      ) : null}
      <RunWarnings comparison={comparison} />
    </Alert>
  );
}

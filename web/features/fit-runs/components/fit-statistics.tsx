import { Alert } from '../../../components/alert';
import { Fact } from '../../../components/fact';
import { formatCount } from '../../../lib/format';
import type { FitResultSummary, FitRun, FitSettings } from '../api/get-fit-run';
import { formatDurationMs, formatReducedChi2, formatRmsUs } from '../lib/format-fit';

const SETTING_LABELS: Record<string, string> = {
  ephemeris: 'Solar-system ephemeris',
  clock: 'Clock chain',
  timeScale: 'Time scale',
  earthOrientation: 'Earth orientation',
};

function settingText(value: unknown): string {
  if (value === null || value === undefined || value === '') return '—';
  return typeof value === 'object' ? JSON.stringify(value) : String(value);
}

/** Which engine settings produced the result: the four named ones first, then any others the API sends. */
export function FitSettingsList({ settings }: { settings: FitSettings }) {
  const keys = [...Object.keys(SETTING_LABELS), ...Object.keys(settings).filter((k) => !(k in SETTING_LABELS))];
  return (
    <dl className="grid grid-cols-1 gap-3 text-sm sm:grid-cols-2" aria-label="Engine settings">
      {keys.map((key) => (
        <Fact key={key} label={SETTING_LABELS[key] ?? key}>
          {settingText(settings[key])}
        </Fact>
      ))}
    </dl>
  );
}

/** A warning banner when the fit did not converge or the engine reported warnings; nothing otherwise. */
export function FitWarnings({ result }: { result: FitResultSummary }) {
  if (result.converged && result.warnings.length === 0) return null;
  return (
    <Alert tone="error" title={result.converged ? 'The fit finished with warnings' : 'The fit did not converge'}>
      {!result.converged ? (
        <p>
          The iterations stopped after {result.iterations} without settling; treat the values and uncertainties below as
          unreliable.
        </p>
      ) : null}
      {result.warnings.length > 0 ? (
        <ul className="mt-1 list-disc pl-5">
          {result.warnings.map((w) => (
            <li key={w}>{w}</li>
          ))}
        </ul>
      ) : null}
    </Alert>
  );
}

/** χ², degrees of freedom, reduced χ², weighted RMS, iterations, convergence and the TOAs used. */
export function FitStatistics({ run, result }: { run: Pick<FitRun, 'toaCount' | 'excludedCount' | 'durationMs'>; result: FitResultSummary }) {
  return (
    <dl className="grid grid-cols-2 gap-4 text-sm sm:grid-cols-4" aria-label="Fit statistics">
      <Fact label="χ²">{Number.isFinite(result.chi2) ? result.chi2.toPrecision(6) : '—'}</Fact>
      <Fact label="Degrees of freedom">{formatCount(result.dof)}</Fact>
      <Fact label="Reduced χ²">{formatReducedChi2(result.reducedChi2)}</Fact>
      <Fact label="Weighted RMS">{formatRmsUs(result.weightedRmsUs)}</Fact>
      <Fact label="Iterations">{formatCount(result.iterations)}</Fact>
      <Fact label="Converged">{result.converged ? 'yes' : 'no'}</Fact>
      <Fact label="TOAs">
        {formatCount(run.toaCount)}
        {(run.excludedCount ?? 0) > 0 ? ` (${formatCount(run.excludedCount)} excluded)` : ''}
      </Fact>
      <Fact label="Duration">{formatDurationMs(run.durationMs)}</Fact>
    </dl>
  );
}

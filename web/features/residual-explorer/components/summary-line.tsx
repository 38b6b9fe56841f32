import type { FitEngineSettings } from '../../../../api/contracts/fit-runs';
import { formatCount } from '../../../lib/format';
import { formatReducedChi2, formatRmsUs } from '../../fit-runs/lib/format-fit';
import type { ResidualSummary } from '../lib/residual-summary';

export interface SummaryLineProps {
  summary: ResidualSummary;
  settings: FitEngineSettings;
  fitRunId: number;
  /** What the shown residuals are, e.g. "previewed: companion b off"; null for the fit as stored. */
  previewNote: string | null;
  /** True when the TOAs excluded now differ from those left out at fit time. */
  exclusionsChanged: boolean;
}

/**
 * One line that stays on screen while the page scrolls: TOAs used and excluded, weighted RMS,
 * reduced χ² with its dof, and the settings (ephemeris, clock, time scale) behind the numbers.
 */
export function SummaryLine({ summary, settings, fitRunId, previewNote, exclusionsChanged }: SummaryLineProps) {
  return (
    <div
      role="status"
      aria-label="Summary"
      aria-live="polite"
      className="sticky top-16 z-20 -mx-1 flex flex-wrap items-baseline gap-x-4 gap-y-1 rounded-lg border border-night-700 bg-night-950/95 px-4 py-2 text-sm text-night-200 shadow-lg shadow-black/30 backdrop-blur"
    >
      <span>
        <span className="text-night-400">TOAs used </span>
        <strong className="font-semibold text-night-100" data-testid="summary-used">
          {formatCount(summary.usedCount)}
        </strong>
      </span>
      <span>
        <span className="text-night-400">excluded </span>
        <strong className="font-semibold text-night-100" data-testid="summary-excluded">
          {formatCount(summary.excludedCount)}
        </strong>
      </span>
      <span>
        <span className="text-night-400">weighted RMS </span>
        <strong className="font-semibold text-night-100" data-testid="summary-rms">
          {formatRmsUs(summary.weightedRmsUs)}
        </strong>
      </span>
      <span>
        <span className="text-night-400">reduced χ² </span>
        <strong className="font-semibold text-night-100" data-testid="summary-chi2">
          {formatReducedChi2(summary.reducedChi2)}
        </strong>
        <span className="text-night-400"> ({formatCount(summary.dof)} dof)</span>
      </span>
      <span className="text-xs text-night-400">
        fit #{fitRunId} · {settings.ephemeris} · {settings.clock} · {settings.timeScale}
      </span>
      {previewNote || exclusionsChanged ? (
        <span className="basis-full text-xs text-ember-300">
          {[previewNote, exclusionsChanged ? 'exclusions changed since the fit: figures use the new selection, parameters not refitted' : null]
            .filter(Boolean)
            .join(' · ')}
        </span>
      ) : null}
    </div>
  );
}

import { lazy, Suspense, useMemo } from 'react';
import { LoadingPanel } from '../../../components/query-state';
import type { SearchPeak } from '../api/get-search-run';
import type { SearchPeriodogram } from '../api/get-search-periodograms';
import { formatFap, formatPeriodDays, formatPower } from '../lib/format-search';
import { periodogramSeries } from '../lib/periodogram-series';

const finiteOrNull = (x: number | null | undefined): number | null => (typeof x === 'number' && Number.isFinite(x) ? x : null);

// React.lazy keeps Plotly (several MB) out of the page chunks until a plot is shown.
const PeriodogramPlot = lazy(() => import('./periodogram-plot'));

/** One round's periodogram as a figure with a caption that says what is drawn and what is marked. */
export function RoundPeriodogram({
  periodogram,
  peak,
  falseAlarmThreshold,
}: {
  periodogram: SearchPeriodogram;
  peak: SearchPeak | null;
  falseAlarmThreshold: number;
}) {
  const series = useMemo(() => periodogramSeries(periodogram), [periodogram]);
  // Stored periodograms longer than the server's limit are max-pooled; `pointsPerBin` says by how much (1 or absent: not pooled).
  const binned = (periodogram as { pointsPerBin?: number }).pointsPerBin ?? 1;
  // The server sends the round's threshold power (runs stored before it was kept: none; the peak may still carry it).
  const thresholdPower = finiteOrNull(periodogram.thresholdPower) ?? finiteOrNull(peak?.thresholdPower);
  return (
    <figure aria-label={`Periodogram of round ${periodogram.round}`}>
      <Suspense fallback={<LoadingPanel label="Loading the plot…" />}>
        <PeriodogramPlot series={series} peak={peak} falseAlarmThreshold={falseAlarmThreshold} thresholdPower={thresholdPower} />
      </Suspense>
      <figcaption className="mt-2 text-xs text-night-400">
        Generalized Lomb–Scargle power of the residuals against trial period (logarithmic axis), {periodogram.grid.count.toLocaleString('en-GB')}{' '}
        points
        {binned > 1 ? ` (each point the highest power of ${binned} neighbouring frequencies the engine evaluated)` : ''}
        {series.thinned ? ', thinned for drawing to the extremes of each stretch' : ''}.
        {peak ? ` The diamond marks the chosen peak at ${formatPeriodDays(peak.periodDays)} (FAP ${formatFap(peak.falseAlarmProbability)}).` : ''}{' '}
        {thresholdPower !== null
          ? `The dashed line is the power ${formatPower(thresholdPower)} at which the false-alarm probability (Baluev 2008) equals the threshold ${formatFap(falseAlarmThreshold)}; a peak above it is significant.`
          : 'This run was stored without the power of its false-alarm threshold, so no threshold line is drawn; compare the peak’s FAP with the threshold instead.'}
      </figcaption>
    </figure>
  );
}

import type { ResidualColumns } from '../../residual-plot/api/get-residuals';
import { backendStyle } from '../../residual-plot/lib/backend-styles';
import { residualTraces, WEBGL_POINT_THRESHOLD, type ResidualTrace } from '../../residual-plot/lib/residual-traces';

/** One run's residuals and the label of its panel. */
export interface StackedRun {
  fitRunId: number;
  label: string;
  residuals: ResidualColumns;
}

export type StackedTrace = ResidualTrace & {
  xaxis: 'x';
  yaxis: string;
  legendgroup: string;
  showlegend: boolean;
};

/** Plotly's name of the n-th (0-based) y axis: "y", "y2", "y3", … */
export const yAxisName = (index: number) => (index === 0 ? 'y' : `y${index + 1}`);

/**
 * Traces of several runs' residuals, one panel (y axis) per run and one x axis (MJD) for all,
 * so zooming in time moves every panel together. A backend keeps the same colour and symbol in
 * every panel (styles by the sorted union of backends) and has one legend entry that hides or shows
 * it everywhere.
 *
 * @param runs   the runs from top to bottom
 * @param webgl  whether the browser offers WebGL (Note 1)
 * @returns      traces with `yaxis` set per panel
 *
 * Notes: 1. WebGL (scattergl) draws every panel once all runs together pass WEBGL_POINT_THRESHOLD,
 *           as in the single residual plot; below it, or without WebGL (headless or GPU-less
 *           browsers), SVG markers draw them, which is fast enough at that size.
 */
export function stackedResidualTraces(runs: readonly StackedRun[], webgl = true): StackedTrace[] {
  const total = runs.reduce((sum, run) => sum + run.residuals.mjd.length, 0);
  const type = webgl && total > WEBGL_POINT_THRESHOLD ? 'scattergl' : 'scatter'; // Note 1
  const perRun = runs.map((run) => residualTraces(run.residuals));
  const names = [...new Set(perRun.flatMap((traces) => traces.map((t) => t.name)))].sort((a, b) => a.localeCompare(b));
  const seen = new Set<string>();
  return perRun.flatMap((traces, panel) =>
    traces.map((trace) => {
      const style = backendStyle(names.indexOf(trace.name));
      const first = !seen.has(trace.name);
      seen.add(trace.name);
      return {
        ...trace,
        type,
        xaxis: 'x' as const,
        yaxis: yAxisName(panel),
        legendgroup: trace.name,
        showlegend: first,
        marker: { ...trace.marker, color: style.colour, symbol: style.symbol },
        error_y: { ...trace.error_y, color: style.colour },
        hovertemplate: `${runs[panel].label}<br>${trace.hovertemplate}`,
      };
    }),
  );
}

// The only module of this feature that imports Plotly; load it through lazy-periodogram-plot.tsx
// so Plotly stays in its own chunk.
import Plotly from 'plotly.js-dist-min';
import createPlotlyComponent from 'react-plotly.js/factory';
import { useMemo } from 'react';
import type { SearchPeak } from '../api/get-search-run';
import { formatFap, formatPeriodDays } from '../lib/format-search';
import type { PeriodogramSeries } from '../lib/periodogram-series';

// The factory form: the package's default entry imports a plotly build this app does not ship.
const Plot = createPlotlyComponent(Plotly);

// Colours of the app's night theme (tailwind.config.ts); the peak differs by marker shape too.
const AXIS_COLOUR = '#a3aaca';
const GRID_COLOUR = '#2a3259';
const CURVE_COLOUR = '#8fb4ff';
const PEAK_COLOUR = '#ef8a32';
const THRESHOLD_COLOUR = '#e8e2c8';
const WEBGL_ABOVE_POINTS = 3000;
/** In the layout and as the element's style: a responsive redraw sizes from the container, which may offer 0 px. */
const PLOT_HEIGHT_PX = 300;

export interface PeriodogramPlotProps {
  series: PeriodogramSeries;
  /** the round's strongest peak, marked with a diamond */
  peak: SearchPeak | null;
  /** the power at which the false-alarm probability equals the run's threshold, when known */
  thresholdPower?: number | null;
  falseAlarmThreshold: number;
}

/** Power against period (log axis) for one round, the chosen peak marked, the threshold level dashed when known. */
export default function PeriodogramPlot({ series, peak, thresholdPower, falseAlarmThreshold }: PeriodogramPlotProps) {
  const data = useMemo(() => {
    const traces: Record<string, unknown>[] = [
      {
        type: series.periodDays.length > WEBGL_ABOVE_POINTS ? 'scattergl' : 'scatter',
        mode: 'lines',
        name: 'Power',
        x: series.periodDays,
        y: series.power,
        line: { color: CURVE_COLOUR, width: 1 },
        hovertemplate: '%{x:.6g} d<br>power %{y:.3f}<extra></extra>',
      },
    ];
    if (peak) {
      traces.push({
        type: 'scatter',
        mode: 'markers',
        name: `Chosen peak (FAP ${formatFap(peak.falseAlarmProbability)})`,
        x: [peak.periodDays],
        y: [peak.power],
        marker: { symbol: 'diamond', size: 12, color: PEAK_COLOUR, line: { color: '#0b0f24', width: 1 } },
        hovertemplate: `${formatPeriodDays(peak.periodDays)}<br>power %{y:.3f}<br>FAP ${formatFap(peak.falseAlarmProbability)}<extra></extra>`,
      });
    }
    return traces;
  }, [series, peak]);
  const layout = useMemo(
    () => ({
      autosize: true,
      height: PLOT_HEIGHT_PX,
      margin: { l: 56, r: 16, t: 12, b: 48 },
      paper_bgcolor: 'rgba(0,0,0,0)',
      plot_bgcolor: 'rgba(0,0,0,0)',
      font: { color: AXIS_COLOUR, family: 'Inter Variable, system-ui, sans-serif' },
      xaxis: { type: 'log', title: { text: 'Period (days)' }, gridcolor: GRID_COLOUR, exponentformat: 'none' },
      yaxis: { title: { text: 'Normalised power' }, gridcolor: GRID_COLOUR, rangemode: 'tozero' },
      legend: { orientation: 'h', y: -0.25 },
      hovermode: 'closest',
      shapes:
        typeof thresholdPower === 'number'
          ? [{ type: 'line', xref: 'paper', x0: 0, x1: 1, y0: thresholdPower, y1: thresholdPower, line: { color: THRESHOLD_COLOUR, width: 1, dash: 'dash' } }]
          : [],
      annotations:
        typeof thresholdPower === 'number'
          ? [{ xref: 'paper', x: 1, xanchor: 'right', y: thresholdPower, yanchor: 'bottom', showarrow: false, text: `False-alarm threshold ${formatFap(falseAlarmThreshold)}`, font: { size: 11, color: THRESHOLD_COLOUR } }]
          : [],
    }),
    [thresholdPower, falseAlarmThreshold],
  );
  return <Plot data={data} layout={layout} config={{ displaylogo: false, responsive: true }} useResizeHandler style={{ width: '100%', height: PLOT_HEIGHT_PX }} className="w-full" />;
}

// Plotly for the periodogram panel; load it with React.lazy so Plotly stays in its own chunk.
import Plotly from 'plotly.js-dist-min';
import createPlotlyComponent from 'react-plotly.js/factory';
import { useMemo } from 'react';
import { FAP_LEVELS, type ResidualPeriodogram } from './residual-periodogram';

const Plot = createPlotlyComponent(Plotly);

// Colours of the app's night theme (tailwind.config.ts); levels differ by dash pattern as well as colour.
const AXIS_COLOUR = '#a3aaca';
const GRID_COLOUR = '#2a3259';
const POWER_COLOUR = '#56B4E9';
const LEVEL_STYLES = [
  { colour: '#E69F00', dash: 'dash' },
  { colour: '#CC79A7', dash: 'dot' },
] as const;
const PEAK_COLOUR = '#F0E442';
/** The plot's height, px: in the layout and as the element's style (Note of PeriodogramPlot). */
export const PERIODOGRAM_PLOT_HEIGHT_PX = 280;

export interface PeriodogramPlotProps {
  periodogram: ResidualPeriodogram;
  /** index into periodogram.peaks of the chosen peak, or null */
  chosenPeak: number | null;
  /** a click on the plot, at this period (days) */
  onPickPeriod(periodDays: number): void;
}

/**
 * Power against period (log axis), the FAP levels as dashed/dotted lines and the listed peaks numbered.
 *
 * Note: the element's style carries the height as well as the layout: with a responsive redraw Plotly
 * sizes the plot from its container, and a container without a height of its own can hand it 0 px.
 */
export default function PeriodogramPlot({ periodogram, chosenPeak, onPickPeriod }: PeriodogramPlotProps) {
  const data = useMemo(() => {
    const { periodDays, power, fapLevelPowers, peaks, minPeriodDays, maxPeriodDays } = periodogram;
    const levelX = [Math.min(minPeriodDays, maxPeriodDays), maxPeriodDays];
    return [
      {
        type: 'scatter',
        mode: 'lines',
        name: 'Power',
        x: Array.from(periodDays),
        y: Array.from(power),
        line: { color: POWER_COLOUR, width: 1 },
        hovertemplate: 'period %{x:.5g} d<br>power %{y:.4f}<extra></extra>',
      },
      ...FAP_LEVELS.map((level, i) => ({
        type: 'scatter',
        mode: 'lines',
        name: `FAP ${level.toExponential(0)}`,
        x: levelX,
        y: [fapLevelPowers[i], fapLevelPowers[i]],
        line: { color: LEVEL_STYLES[i].colour, dash: LEVEL_STYLES[i].dash, width: 1.5 },
        hovertemplate: `power %{y:.4f} (false-alarm probability ${level.toExponential(0)})<extra></extra>`,
      })),
      {
        type: 'scatter',
        mode: 'text+markers',
        name: 'Listed peaks',
        x: peaks.map((p) => p.periodDays),
        y: peaks.map((p) => p.power),
        text: peaks.map((_, i) => String(i + 1)),
        textposition: 'top center',
        textfont: { color: AXIS_COLOUR },
        marker: {
          color: PEAK_COLOUR,
          size: peaks.map((_, i) => (i === chosenPeak ? 13 : 8)),
          symbol: peaks.map((_, i) => (i === chosenPeak ? 'diamond' : 'circle-open')),
          line: { color: PEAK_COLOUR, width: 1.5 },
        },
        hovertemplate: 'peak %{text}: %{x:.5g} d<extra></extra>',
      },
    ];
  }, [periodogram, chosenPeak]);
  const layout = useMemo(
    () => ({
      autosize: true,
      height: PERIODOGRAM_PLOT_HEIGHT_PX,
      margin: { l: 56, r: 16, t: 8, b: 44 },
      paper_bgcolor: 'rgba(0,0,0,0)',
      plot_bgcolor: 'rgba(0,0,0,0)',
      font: { color: AXIS_COLOUR, family: 'Inter Variable, system-ui, sans-serif' },
      xaxis: { title: { text: 'Period (days)' }, type: 'log', gridcolor: GRID_COLOUR, exponentformat: 'none' },
      yaxis: { title: { text: 'Power (normalised)' }, gridcolor: GRID_COLOUR, rangemode: 'tozero' },
      legend: { orientation: 'h', y: -0.25 },
      hovermode: 'closest',
      showlegend: true,
    }),
    [],
  );
  return (
    <Plot
      data={data as Plotly.Data[]}
      layout={layout as Partial<Plotly.Layout>}
      config={{ displaylogo: false, responsive: true }}
      useResizeHandler
      style={{ width: '100%', height: PERIODOGRAM_PLOT_HEIGHT_PX }} // an explicit height: see the Note above
      className="w-full"
      onClick={(event: Readonly<Plotly.PlotMouseEvent>) => {
        const x = event.points?.[0]?.x;
        if (typeof x === 'number') onPickPeriod(x);
      }}
    />
  );
}

// The only module that imports Plotly; load it through lazy-residual-plot.tsx so Plotly gets its own chunk.
import Plotly from 'plotly.js-dist-min';
import createPlotlyComponent from 'react-plotly.js/factory';
import { useMemo } from 'react';
import type { ResidualColumns } from '../api/get-residuals';
import { residualTraces } from '../lib/residual-traces';

// The factory form: the package's default entry imports a plotly build this app does not ship.
const Plot = createPlotlyComponent(Plotly);

// Colours of the app's night theme (tailwind.config.ts).
const AXIS_COLOUR = '#a3aaca';
const GRID_COLOUR = '#2a3259';
const ZERO_LINE_COLOUR = '#58618a';

/** Residuals (µs) with error bars against MJD, one trace per backend; fills the width of its parent. */
export default function ResidualPlot({ residuals, title }: { residuals: ResidualColumns; title?: string }) {
  const data = useMemo(() => residualTraces(residuals), [residuals]);
  const layout = useMemo(
    () => ({
      autosize: true,
      height: 360,
      margin: { l: 64, r: 16, t: title ? 36 : 12, b: 48 },
      title: title ? { text: title, font: { size: 13, color: AXIS_COLOUR } } : undefined,
      paper_bgcolor: 'rgba(0,0,0,0)',
      plot_bgcolor: 'rgba(0,0,0,0)',
      font: { color: AXIS_COLOUR, family: 'Inter Variable, system-ui, sans-serif' },
      xaxis: { title: { text: 'MJD (day)' }, gridcolor: GRID_COLOUR, zeroline: false, exponentformat: 'none' }, // 58000, not "58k"
      yaxis: { title: { text: 'Residual (µs)' }, gridcolor: GRID_COLOUR, zerolinecolor: ZERO_LINE_COLOUR },
      legend: { orientation: 'h', y: -0.2 },
      hovermode: 'closest',
    }),
    [title],
  );
  return (
    <Plot
      data={data}
      layout={layout}
      config={{ displaylogo: false, responsive: true }}
      useResizeHandler
      style={{ width: '100%' }}
      className="w-full"
    />
  );
}

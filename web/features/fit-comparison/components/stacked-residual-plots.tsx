// Imports Plotly: load it only through stacked-residuals-panel.tsx (React.lazy), so Plotly stays in its own chunk.
import Plotly from 'plotly.js-dist-min';
import createPlotlyComponent from 'react-plotly.js/factory';
import { useMemo, useState } from 'react';
import { stackedResidualTraces, yAxisName, type StackedRun } from '../lib/stacked-residual-traces';

const Plot = createPlotlyComponent(Plotly);

// Colours of the app's night theme (tailwind.config.ts), as in the single residual plot.
const AXIS_COLOUR = '#a3aaca';
const GRID_COLOUR = '#2a3259';
const ZERO_LINE_COLOUR = '#58618a';
const PANEL_HEIGHT_PX = 200;
const PANEL_GAP = 0.04; // of the plot height, between panels

/** True when the browser can give a WebGL context (no GPU, or a headless browser, often cannot). */
function browserHasWebGl(): boolean {
  if (typeof WebGLRenderingContext === 'undefined') return false;
  try {
    const canvas = document.createElement('canvas');
    return Boolean(canvas.getContext('webgl2') ?? canvas.getContext('webgl'));
  } catch {
    return false;
  }
}

/** The runs' residuals in panels stacked top to bottom, sharing one MJD axis. */
export default function StackedResidualPlots({ runs }: { runs: StackedRun[] }) {
  const [webgl] = useState(browserHasWebGl);
  const data = useMemo(() => stackedResidualTraces(runs, webgl), [runs, webgl]);
  const layout = useMemo(() => {
    const n = runs.length;
    const share = (1 - PANEL_GAP * (n - 1)) / n;
    const yAxes = Object.fromEntries(
      runs.map((run, i) => {
        const top = 1 - i * (share + PANEL_GAP);
        const name = i === 0 ? 'yaxis' : `yaxis${i + 1}`;
        return [
          name,
          {
            domain: [Math.max(0, top - share), top],
            title: { text: `#${run.fitRunId} (µs)`, font: { size: 11 } },
            gridcolor: GRID_COLOUR,
            zerolinecolor: ZERO_LINE_COLOUR,
            anchor: 'x',
          },
        ];
      }),
    );
    return {
      autosize: true,
      height: PANEL_HEIGHT_PX * n + 90,
      margin: { l: 72, r: 16, t: 24, b: 48 },
      paper_bgcolor: 'rgba(0,0,0,0)',
      plot_bgcolor: 'rgba(0,0,0,0)',
      font: { color: AXIS_COLOUR, family: 'Inter Variable, system-ui, sans-serif' },
      xaxis: { title: { text: 'MJD (day)' }, gridcolor: GRID_COLOUR, zeroline: false, exponentformat: 'none', anchor: yAxisName(n - 1) },
      ...yAxes,
      annotations: runs.map((run, i) => ({
        text: run.label,
        xref: 'paper',
        yref: 'paper',
        x: 0,
        xanchor: 'left',
        y: 1 - i * (share + PANEL_GAP),
        yanchor: 'bottom',
        showarrow: false,
        font: { size: 11, color: AXIS_COLOUR },
      })),
      legend: { orientation: 'h', y: -0.12 },
      hovermode: 'closest',
    };
  }, [runs]);
  return <Plot data={data} layout={layout} config={{ displaylogo: false, responsive: true }} useResizeHandler style={{ width: '100%' }} className="w-full" />;
}

// The explorer's only Plotly import; load it through React.lazy so Plotly gets its own chunk.
import Plotly from 'plotly.js-dist-min';
import createPlotlyComponent from 'react-plotly.js/factory';
import { useCallback, useEffect, useMemo, useRef } from 'react';
import type { ExplorerTrace } from '../lib/explorer-traces';

const Plot = createPlotlyComponent(Plotly);

// Colours of the app's night theme (tailwind.config.ts).
const AXIS_COLOUR = '#a3aaca';
const GRID_COLOUR = '#2a3259';
const ZERO_LINE_COLOUR = '#58618a';

export type ImageFormat = 'png' | 'svg';

/** What the screen can ask of a drawn plot. */
export interface PlotHandle {
  downloadImage(format: ImageFormat, fileName: string): Promise<void>;
}

export interface ExplorerPlotProps {
  traces: ExplorerTrace[];
  xTitle: string;
  yTitle: string;
  /** Bumped whenever `traces` change, so Plotly redraws without deep comparison. */
  revision: number;
  /** Called with the table row indices inside a box or lasso (empty when the selection is cleared). */
  onSelect(indices: number[]): void;
  onReady?(handle: PlotHandle | null): void;
  /** Legend click (hide or show that group) and double-click (show only it); the screen keeps the state. */
  onLegendToggle?(traceName: string): void;
  onLegendIsolate?(traceName: string): void;
  height?: number;
}

interface SelectedPoint {
  customdata?: unknown;
}

/** Residuals against the chosen x quantity; box and lasso select TOAs; the legend hides groups. */
export default function ExplorerPlot({ traces, xTitle, yTitle, revision, onSelect, onReady, onLegendToggle, onLegendIsolate, height = 420 }: ExplorerPlotProps) {
  const graphDiv = useRef<HTMLElement | null>(null);
  // Keeps the user's zoom, hidden legend groups and drag mode across redraws of the same axes.
  const uiRevision = `${xTitle}|${yTitle}`;
  const layout = useMemo(
    () => ({
      autosize: true,
      height,
      margin: { l: 72, r: 16, t: 12, b: 52 },
      paper_bgcolor: 'rgba(0,0,0,0)',
      plot_bgcolor: 'rgba(0,0,0,0)',
      font: { color: AXIS_COLOUR, family: 'Inter Variable, system-ui, sans-serif' },
      xaxis: { title: { text: xTitle }, gridcolor: GRID_COLOUR, zeroline: false, exponentformat: 'none' as const },
      yaxis: { title: { text: yTitle }, gridcolor: GRID_COLOUR, zerolinecolor: ZERO_LINE_COLOUR, exponentformat: 'power' as const },
      legend: { orientation: 'h' as const, y: -0.16, itemclick: 'toggle' as const, itemdoubleclick: 'toggleothers' as const },
      hovermode: 'closest' as const,
      dragmode: 'select' as const,
      uirevision: uiRevision,
      datarevision: revision,
    }),
    [height, xTitle, yTitle, uiRevision, revision],
  );

  const handle = useMemo<PlotHandle>(
    () => ({
      async downloadImage(format, fileName) {
        if (!graphDiv.current) throw new Error('The plot is not drawn yet');
        await Plotly.downloadImage(graphDiv.current, { format, filename: fileName, width: 1400, height: 700 });
      },
    }),
    [],
  );
  useEffect(() => () => onReady?.(null), [onReady]);

  const remember = useCallback(
    (_figure: unknown, div: HTMLElement) => {
      graphDiv.current = div;
      onReady?.(handle);
    },
    [handle, onReady],
  );

  const selected = useCallback(
    (event: { points?: SelectedPoint[] } | undefined) => {
      if (!event?.points) return; // Plotly also fires with no event when a drag selects nothing
      const indices: number[] = [];
      for (const point of event.points) if (typeof point.customdata === 'number') indices.push(point.customdata);
      onSelect(indices);
    },
    [onSelect],
  );

  return (
    <Plot
      data={traces}
      layout={layout}
      revision={revision}
      config={{
        displaylogo: false,
        responsive: true,
        modeBarButtonsToRemove: ['toImage'], // the explorer's own export buttons name the formats
      }}
      onInitialized={remember}
      onUpdate={remember}
      onSelected={selected}
      onDeselect={() => onSelect([])}
      onLegendClick={(event: { curveNumber: number }) => {
        const name = traces[event.curveNumber]?.name;
        if (name && onLegendToggle) onLegendToggle(name);
        return !onLegendToggle; // false: the screen, not Plotly, decides what is shown
      }}
      onLegendDoubleClick={(event: { curveNumber: number }) => {
        const name = traces[event.curveNumber]?.name;
        if (name && onLegendIsolate) onLegendIsolate(name);
        return !onLegendIsolate;
      }}
      useResizeHandler
      style={{ width: '100%', height }} // an explicit height: a responsive Plotly redraw can otherwise collapse to 0
      className="w-full"
    />
  );
}

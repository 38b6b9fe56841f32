/**
 * The two periodogram plots as Plotly is handed them: the search run's plot draws
 * the false-alarm threshold as a dashed line with its label when the server sent
 * the threshold power (and nothing when it did not), and both plots give Plotly an
 * explicit style height with the resize handler, so a responsive redraw cannot
 * collapse them to 0 px.
 */
import { cleanup, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import SearchPeriodogramPlot from '../../web/features/search-runs/components/periodogram-plot';
import ExplorerPeriodogramPlot from '../../web/features/residual-explorer/lib/panels/periodogram-plot';
import { computeResidualPeriodogram } from '../../web/features/residual-explorer/lib/panels/residual-periodogram';
import { createSeededNormal, createSeededUniform } from '../../worker/timing/fit/seeded-normal';

interface PlotProps {
  layout: { height: number; shapes?: { type: string; y0: number; y1: number; line: { dash: string } }[]; annotations?: { y: number; text: string }[] };
  style: { width?: string; height?: number | string };
  useResizeHandler?: boolean;
}
const received: PlotProps[] = [];
vi.mock('plotly.js-dist-min', () => ({ default: {} }));
vi.mock('react-plotly.js/factory', () => ({
  default: () =>
    function FakePlot(props: PlotProps) {
      received.push(props);
      return <div data-testid="plotly" />;
    },
}));

afterEach(() => {
  cleanup();
  received.length = 0;
});

const series = { periodDays: [400, 200, 100, 50], power: [0.1, 0.6, 0.2, 0.05], thinned: false };
const peak = { round: 1, periodDays: 200, frequencyPerDay: 1 / 200, power: 0.6, falseAlarmProbability: 2e-9, significant: true, aliasWarnings: [] };
const last = () => received[received.length - 1];

describe('search-run periodogram plot', () => {
  it('draws the threshold power as a dashed horizontal line labelled with the threshold', () => {
    render(<SearchPeriodogramPlot series={series} peak={peak} thresholdPower={0.173} falseAlarmThreshold={0.001} />);
    expect(screen.getByTestId('plotly')).toBeTruthy();
    const { shapes = [], annotations = [] } = last().layout;
    expect(shapes).toHaveLength(1);
    expect(shapes[0]).toMatchObject({ type: 'line', y0: 0.173, y1: 0.173, line: { dash: 'dash' } });
    expect(annotations).toHaveLength(1);
    expect(annotations[0]).toMatchObject({ y: 0.173, text: 'False-alarm threshold 1.0e-3' });
  });

  it('draws no line and no label without a threshold power (runs stored before it was kept)', () => {
    render(<SearchPeriodogramPlot series={series} peak={peak} thresholdPower={null} falseAlarmThreshold={0.001} />);
    expect(last().layout.shapes).toEqual([]);
    expect(last().layout.annotations).toEqual([]);
  });

  it('gives Plotly an explicit height in the style as well as the layout', () => {
    render(<SearchPeriodogramPlot series={series} peak={null} falseAlarmThreshold={0.001} />);
    expect(last().useResizeHandler).toBe(true);
    expect(last().style.height).toBe(last().layout.height);
    expect(last().layout.height).toBeGreaterThan(0);
  });
});

describe('explorer periodogram plot', () => {
  it('gives Plotly an explicit height in the style as well as the layout, with the resize handler', () => {
    // Invented residuals: 80 TOAs over 900 d, σ = 1 µs, white noise.
    const uniform = createSeededUniform(3);
    const normal = createSeededNormal(4);
    const tDays = Float64Array.from(Array.from({ length: 80 }, () => uniform() * 900).sort((a, b) => a - b));
    const periodogram = computeResidualPeriodogram({ tDays, residualUs: tDays.map(() => normal()), uncertaintyUs: new Float64Array(80).fill(1) });
    render(<ExplorerPeriodogramPlot periodogram={periodogram} chosenPeak={null} onPickPeriod={() => {}} />);
    expect(last().useResizeHandler).toBe(true);
    expect(typeof last().style.height).toBe('number');
    expect(last().style.height).toBe(last().layout.height);
    expect(last().layout.height).toBeGreaterThan(0);
  });
});

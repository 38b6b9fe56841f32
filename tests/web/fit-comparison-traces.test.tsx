/** The stacked residual traces of the comparison screen: panels, shared x axis, styles, WebGL choice. */
import { describe, expect, it } from 'vitest';
import { backendStyle } from '../../web/features/residual-plot/lib/backend-styles';
import { WEBGL_POINT_THRESHOLD } from '../../web/features/residual-plot/lib/residual-traces';
import { stackedResidualTraces, yAxisName, type StackedRun } from '../../web/features/fit-comparison/lib/stacked-residual-traces';

function run(fitRunId: number, count: number, backends: string[]): StackedRun {
  return {
    fitRunId,
    label: `Run #${fitRunId}`,
    residuals: {
      count,
      toaId: Array.from({ length: count }, (_, i) => i + 1),
      mjd: Array.from({ length: count }, (_, i) => `${58000 + i}.25`),
      residualUs: Array.from({ length: count }, (_, i) => i % 7),
      uncertaintyUs: Array.from({ length: count }, () => 1),
      frequencyMhz: Array.from({ length: count }, () => 1400),
      backend: Array.from({ length: count }, (_, i) => backends[i % backends.length]),
      observatory: Array.from({ length: count }, () => 'obs-a'),
    },
  };
}

describe('stackedResidualTraces', () => {
  it('names Plotly’s y axes y, y2, y3, …', () => {
    expect([0, 1, 2, 3].map(yAxisName)).toEqual(['y', 'y2', 'y3', 'y4']);
  });

  it('puts each run in its own panel on the one x axis, and styles a backend alike in every panel', () => {
    const traces = stackedResidualTraces([run(1, 4, ['b-2']), run(2, 6, ['b-1', 'b-2']), run(3, 2, ['b-3'])]);
    expect(traces.map((t) => `${t.yaxis}:${t.name}:${t.x.length}`)).toEqual(['y:b-2:4', 'y2:b-1:3', 'y2:b-2:3', 'y3:b-3:2']);
    expect(new Set(traces.map((t) => t.xaxis))).toEqual(new Set(['x']));
    // Styles by the sorted union b-1, b-2, b-3, so b-2 keeps style 1 in both panels.
    const b2 = traces.filter((t) => t.name === 'b-2');
    for (const t of b2) expect(t.marker).toMatchObject({ color: backendStyle(1).colour, symbol: backendStyle(1).symbol });
    expect(traces.map((t) => t.showlegend)).toEqual([true, true, false, true]);
    expect(traces.every((t) => t.legendgroup === t.name)).toBe(true);
    expect(traces[1].hovertemplate.startsWith('Run #2<br>')).toBe(true);
  });

  it('switches every panel to WebGL once all runs together pass the threshold, and never without WebGL', () => {
    const half = Math.floor(WEBGL_POINT_THRESHOLD / 2);
    const small = [run(1, half, ['a']), run(2, half, ['a'])];
    const large = [run(1, half + 1, ['a']), run(2, half, ['a'])];
    expect(new Set(stackedResidualTraces(small).map((t) => t.type))).toEqual(new Set(['scatter']));
    expect(new Set(stackedResidualTraces(large).map((t) => t.type))).toEqual(new Set(['scattergl']));
    expect(new Set(stackedResidualTraces(large, false).map((t) => t.type))).toEqual(new Set(['scatter']));
  });

  it('gives no traces for runs without residuals', () => {
    expect(stackedResidualTraces([run(1, 0, ['a']), run(2, 0, ['a'])])).toEqual([]);
  });
});

import { describe, expect, it } from 'vitest';
import type { ResidualColumns } from '../../web/features/residual-plot/api/get-residuals';
import { BACKEND_COLOURS, BACKEND_SYMBOLS, backendStyle } from '../../web/features/residual-plot/lib/backend-styles';
import { residualTraces, WEBGL_POINT_THRESHOLD } from '../../web/features/residual-plot/lib/residual-traces';

// Invented residuals: backends interleaved so grouping has work to do.
function columns(n: number, backends: string[]): ResidualColumns {
  const idx = Array.from({ length: n }, (_, i) => i);
  return {
    count: n,
    toaId: idx.map((i) => 1000 + i),
    mjd: idx.map((i) => `${58000 + i}.${String(i).padStart(3, '0')}123456789012`),
    residualUs: idx.map((i) => (i % 7) - 3),
    uncertaintyUs: idx.map((i) => 0.5 + i / 100),
    frequencyMhz: idx.map((i) => (i % 3 === 0 ? null : 1400)),
    backend: idx.map((i) => backends[i % backends.length]),
    observatory: idx.map(() => 'obs-a'),
  };
}

describe('residualTraces', () => {
  it('makes one trace per backend, sorted by name, carrying only that backend’s points', () => {
    const data = columns(9, ['zeta-1', 'alpha-2', 'mid-3']);
    const traces = residualTraces(data);
    expect(traces.map((t) => t.name)).toEqual(['alpha-2', 'mid-3', 'zeta-1']);
    const alpha = traces[0];
    // alpha-2 sits at indices 1, 4, 7.
    expect(alpha.customdata).toEqual([1001, 1004, 1007]);
    expect(alpha.y).toEqual([data.residualUs[1], data.residualUs[4], data.residualUs[7]]);
    expect(alpha.error_y.array).toEqual([data.uncertaintyUs[1], data.uncertaintyUs[4], data.uncertaintyUs[7]]);
    expect(alpha.x[0]).toBeCloseTo(58001.001123456789, 6);
    expect(traces.reduce((sum, t) => sum + t.x.length, 0)).toBe(9);
  });

  it('gives every backend its own colour AND its own marker symbol', () => {
    const traces = residualTraces(columns(14, ['a', 'b', 'c', 'd', 'e', 'f', 'g']));
    const colours = traces.map((t) => t.marker.color);
    const symbols = traces.map((t) => t.marker.symbol);
    expect(new Set(colours).size).toBe(7);
    expect(new Set(symbols).size).toBe(7);
    for (const t of traces) expect(t.error_y.color).toBe(t.marker.color);
  });

  it('keeps (colour, symbol) pairs distinct well past the palette length', () => {
    const pairs = new Set(Array.from({ length: BACKEND_COLOURS.length * BACKEND_SYMBOLS.length }, (_, i) => JSON.stringify(backendStyle(i))));
    expect(pairs.size).toBe(BACKEND_COLOURS.length * BACKEND_SYMBOLS.length);
  });

  it('switches to scattergl only above the point threshold', () => {
    expect(residualTraces(columns(WEBGL_POINT_THRESHOLD, ['a', 'b'])).every((t) => t.type === 'scatter')).toBe(true);
    expect(residualTraces(columns(WEBGL_POINT_THRESHOLD + 1, ['a', 'b'])).every((t) => t.type === 'scattergl')).toBe(true);
  });

  it('returns no traces for no residuals', () => {
    expect(residualTraces(columns(0, ['a']))).toEqual([]);
  });
});

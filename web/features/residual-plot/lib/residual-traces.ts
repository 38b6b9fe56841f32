import type { ResidualColumns } from '../api/get-residuals';
import { backendStyle } from './backend-styles';

/** Above this many points the WebGL scatter type draws them; SVG markers get slow (common practice). */
export const WEBGL_POINT_THRESHOLD = 2000;

/** The subset of a Plotly scatter trace that the residual plot builds. */
export interface ResidualTrace {
  type: 'scatter' | 'scattergl';
  mode: 'markers';
  name: string;
  x: number[];
  y: number[];
  error_y: { type: 'data'; array: number[]; visible: true; thickness: number; width: number; color: string };
  marker: { color: string; symbol: string; size: number };
  customdata: number[];
  hovertemplate: string;
}

/**
 * One Plotly trace per backend from the columnar residuals: x = MJD (day), y = residual (µs) with
 * the TOA uncertainty (µs) as the error bar. Backends are sorted by name so a backend keeps its
 * colour and symbol from run to run (see backendStyle).
 *
 * @param residuals  GET /api/fit-runs/:id/residuals
 * @returns          traces in backend-name order; empty for no residuals
 *
 * Notes: 1. The MJD string becomes one double only for drawing: 1e-11 day (~1 µs) of rounding
 *           is far below a pixel on a span of years. Values are never computed from it.
 *        2. scattergl is chosen for all traces once the total passes WEBGL_POINT_THRESHOLD.
 */
export function residualTraces(residuals: ResidualColumns): ResidualTrace[] {
  const n = residuals.mjd.length;
  const indicesByBackend = new Map<string, number[]>();
  for (let i = 0; i < n; i++) {
    const backend = residuals.backend[i] ?? '';
    let list = indicesByBackend.get(backend);
    if (!list) indicesByBackend.set(backend, (list = []));
    list.push(i);
  }
  const type = n > WEBGL_POINT_THRESHOLD ? 'scattergl' : 'scatter';
  const backends = [...indicesByBackend.keys()].sort((a, b) => a.localeCompare(b));
  return backends.map((backend, b) => {
    const indices = indicesByBackend.get(backend)!;
    const style = backendStyle(b);
    return {
      type,
      mode: 'markers',
      name: backend === '' ? '(no backend)' : backend,
      x: indices.map((i) => Number(residuals.mjd[i])), // Note 1
      y: indices.map((i) => residuals.residualUs[i]),
      error_y: { type: 'data', array: indices.map((i) => residuals.uncertaintyUs[i]), visible: true, thickness: 1, width: 0, color: style.colour },
      marker: { color: style.colour, symbol: style.symbol, size: 6 },
      customdata: indices.map((i) => residuals.toaId[i]),
      hovertemplate: 'MJD %{x:.5f}<br>%{y:.3f} ± %{error_y.array:.3f} µs<br>TOA %{customdata}<extra>%{fullData.name}</extra>',
    };
  });
}

/**
 * Plotly traces of the residual explorer: one per TOA group (colour AND symbol per group,
 * excluded TOAs hollow grey), error bars, and hover text with the TOA's details.
 */
import type { ExplorerTable } from '../../../../api/contracts/explorer';
import { WEBGL_POINT_THRESHOLD } from '../../residual-plot/lib/residual-traces';
import type { ToaGroup } from './explorer-groups';

export const Y_UNITS = ['us', 'turns'] as const;
export type YUnit = (typeof Y_UNITS)[number];
export const Y_UNIT_LABELS: Record<YUnit, string> = { us: 'microseconds', turns: 'turns of spin phase' };
export const Y_AXIS_TITLES: Record<YUnit, string> = { us: 'Residual (µs)', turns: 'Residual (turns)' };

/** The subset of a Plotly scatter trace the explorer builds. */
export interface ExplorerTrace {
  type: 'scatter' | 'scattergl';
  mode: 'markers' | 'lines';
  name: string;
  x: Float64Array;
  y: Float64Array;
  error_y?: { type: 'data'; array: Float64Array; visible: true; thickness: number; width: number; color: string };
  marker?: { color: string; symbol: string; size: number; line?: { color: string; width: number } };
  line?: { color: string; width: number; dash?: string };
  customdata?: Int32Array; // row index into the explorer table
  text?: string[];
  hovertemplate?: string;
  hoverinfo?: 'skip';
  selectedpoints?: number[] | null;
  visible?: true | 'legendonly';
}

/** One hover line per TOA with what does not change under a preview (built once per table). */
export function hoverDetails(table: ExplorerTable): string[] {
  const out = new Array<string>(table.count);
  for (let i = 0; i < table.count; i++) {
    const f = table.frequencyMhz[i];
    out[i] =
      `TOA ${table.toaId[i]} · batch ${table.batchId[i]}, row ${table.batchRow[i]}<br>` +
      `MJD ${table.mjd[i]}<br>${table.observatory[i]} · ${table.backend[i]} · ${f === null ? '∞' : `${f} MHz`}`;
  }
  return out;
}

/** µs → turns of spin phase: Δφ = F·Δt (F in Hz, Δt in s). */
export function usToTurns(valueUs: number, spinFrequencyHz: number): number {
  return valueUs * 1e-6 * spinFrequencyHz;
}

export interface TraceInputs {
  groups: readonly ToaGroup[];
  x: Float64Array;
  residualUs: ArrayLike<number>;
  uncertaintyUs: ArrayLike<number>;
  yUnit: YUnit;
  spinFrequencyHz: number;
  hover: readonly string[];
  /** Selected row indices (highlighted; the rest dimmed), or null for no selection. */
  selected: ReadonlySet<number> | null;
  /** Group names hidden by the user (kept in the legend, not drawn). */
  hidden?: ReadonlySet<string>;
}

/**
 * One marker trace per group. WebGL ('scattergl') once the table passes WEBGL_POINT_THRESHOLD.
 * Hover: the static details, then the residual and uncertainty in the shown unit.
 */
export function explorerTraces(input: TraceInputs): ExplorerTrace[] {
  const total = input.groups.reduce((n, g) => n + g.indices.length, 0);
  const type = total > WEBGL_POINT_THRESHOLD ? 'scattergl' : 'scatter';
  const scale = input.yUnit === 'turns' ? 1e-6 * input.spinFrequencyHz : 1;
  const unit = input.yUnit === 'turns' ? 'turns' : 'µs';
  const digits = input.yUnit === 'turns' ? '.3e' : '.3f';
  return input.groups.map((group) => {
    const n = group.indices.length;
    const x = new Float64Array(n);
    const y = new Float64Array(n);
    const e = new Float64Array(n);
    const text = new Array<string>(n);
    const selectedpoints: number[] = [];
    for (let k = 0; k < n; k++) {
      const i = group.indices[k];
      x[k] = input.x[i];
      y[k] = input.residualUs[i] * scale;
      e[k] = input.uncertaintyUs[i] * scale;
      text[k] = input.hover[i];
      if (input.selected?.has(i)) selectedpoints.push(k);
    }
    return {
      type,
      mode: 'markers',
      name: group.name,
      x,
      y,
      error_y: { type: 'data', array: e, visible: true, thickness: 1, width: 0, color: group.excluded ? '#5d6384' : group.style.colour },
      marker: group.excluded
        ? { color: group.style.colour, symbol: group.style.symbol, size: 7, line: { color: group.style.colour, width: 1.5 } }
        : { color: group.style.colour, symbol: group.style.symbol, size: 7 },
      customdata: group.indices,
      text,
      hovertemplate:
        `%{text}<br>residual %{y:${digits}} ± %{error_y.array:${digits}} ${unit}` +
        `${group.excluded ? '<br>excluded from fits' : ''}<extra>%{fullData.name}</extra>`,
      selectedpoints: input.selected === null ? null : selectedpoints,
      visible: input.hidden?.has(group.name) ? 'legendonly' : true,
    };
  });
}

/**
 * The stored explorer columns of a fit run (api/db/explorer-columns.ts) from
 * the engine's explorer output: fitted and excluded TOAs merged into one list
 * sorted by MJD (then TOA id), with the TOAs' upload rows and stored MJD text.
 */
import type { ExplorerColumns } from '../../api/db/explorer-columns';
import { EXPLORER_FLAG_EVALUATED, EXPLORER_FLAG_EXCLUDED, EXPLORER_FLAG_NEAREST_PULSE, EXPLORER_FLOAT64_KEYS } from '../../api/db/explorer-columns';
import type { Toa } from '../timing/toas/toa';
import type { FitEngineExplorer } from './fit-run-engine';
import type { ExplorerEngineColumns } from './fit-run-explorer';

export interface ExplorerToaSets {
  fitted: { toas: readonly Toa[]; toaIds: readonly number[] };
  excluded: { toas: readonly Toa[]; toaIds: readonly number[] };
  mjdTexts: ReadonlyMap<number, string>;
  batchRows: ReadonlyMap<number, { batchId: number; row: number }>;
}

interface Entry { set: ExplorerEngineColumns; index: number; toa: Toa; id: number; excluded: boolean }

/** MJD order: day, then the fraction (double-double, hi part first), then TOA id. */
function compareEntries(a: Entry, b: Entry): number {
  return a.toa.mjd.day - b.toa.mjd.day || a.toa.mjd.frac[1] - b.toa.mjd.frac[1] || a.toa.mjd.frac[0] - b.toa.mjd.frac[0] || a.id - b.id;
}

/**
 * Merges the engine's explorer output with the TOA metadata.
 *
 * @param explorer  FitEngineOutput.explorer
 * @param sets      the fitted and excluded TOAs with their ids (same order as given to the engine)
 * @param phaseOffsetTurns  the fitted phase offset
 * @returns         ExplorerColumns ready for encodeExplorerColumns
 */
export function buildExplorerColumns(explorer: FitEngineExplorer, sets: ExplorerToaSets, phaseOffsetTurns: number): ExplorerColumns {
  const entries: Entry[] = [
    ...sets.fitted.toas.map((toa, index) => ({ set: explorer.fitted, index, toa, id: sets.fitted.toaIds[index], excluded: false })),
    ...sets.excluded.toas.map((toa, index) => ({ set: explorer.excluded, index, toa, id: sets.excluded.toaIds[index], excluded: true })),
  ].sort(compareEntries);
  const n = entries.length;
  const floats = Object.fromEntries(EXPLORER_FLOAT64_KEYS.map((k) => [k, new Float64Array(n)])) as Record<(typeof EXPLORER_FLOAT64_KEYS)[number], Float64Array>;
  const flags = new Uint8Array(n);
  const partials = explorer.partialPaths.map(() => new Float32Array(n));
  const mjd: string[] = new Array(n);
  const backend: string[] = new Array(n);
  const observatory: string[] = new Array(n);
  entries.forEach((e, i) => {
    const { set, index: k } = e;
    const upload = sets.batchRows.get(e.id);
    floats.toaIds[i] = e.id;
    floats.batchIds[i] = upload?.batchId ?? Number.NaN;
    floats.batchRows[i] = upload?.row ?? Number.NaN;
    floats.frequencyMhz[i] = e.toa.frequencyMhz;
    floats.uncertaintyUs[i] = set.uncertaintyUs[k];
    floats.residualUs[i] = set.residualUs[k];
    floats.barycentricDaysHi[i] = set.barycentricDaysHi[k];
    floats.barycentricDaysLo[i] = set.barycentricDaysLo[k];
    floats.clockS[i] = set.clockS[k];
    floats.ttMinusUtcS[i] = set.ttMinusUtcS[k];
    floats.tdbMinusTtS[i] = set.tdbMinusTtS[k];
    floats.roemerS[i] = set.roemerS[k];
    floats.shapiroS[i] = set.shapiroS[k];
    floats.dispersionS[i] = set.dispersionS[k];
    floats.backendOffsetS[i] = set.backendOffsetS[k];
    floats.companionsS[i] = set.companionsS[k];
    set.partials.forEach((column, j) => { partials[j][i] = column[k]; });
    flags[i] = (e.excluded ? EXPLORER_FLAG_EXCLUDED : 0)
      | (set.nearestPulse[k] === 1 ? EXPLORER_FLAG_NEAREST_PULSE : 0)
      | (Number.isFinite(set.residualUs[k]) ? EXPLORER_FLAG_EVALUATED : 0);
    mjd[i] = sets.mjdTexts.get(e.id) ?? '';
    backend[i] = e.toa.backend;
    observatory[i] = e.toa.observatory;
  });
  return {
    ...floats,
    count: n,
    mjd,
    backend,
    observatory,
    flags,
    partialPaths: explorer.partialPaths,
    partials,
    referenceMjd: explorer.referenceMjd,
    spinFrequencyHz: explorer.spinFrequencyHz,
    phaseOffsetTurns,
  };
}

/**
 * The explorer table of a finished fit run (api/contracts/explorer.ts) from its
 * fit_explorer_columns row. 404 for an unknown run; 409 while the run has not
 * succeeded; 404 `explorer_not_stored` for a run fitted before the explorer
 * columns were stored (re-running the fit stores them).
 */
import type { Knex } from 'knex';
import type { ExplorerTable } from '../../contracts/explorer';
import type { FitEngineSettings, FitResult } from '../../contracts/fit-runs';
import {
  decodeExplorerColumns,
  EXPLORER_FLAG_EVALUATED,
  EXPLORER_FLAG_EXCLUDED,
  EXPLORER_FLAG_NEAREST_PULSE,
  type EncodedExplorerColumns,
} from '../../db/explorer-columns';
import { findFitRun } from '../../db/fit-runs';
import { AppError, notFound } from '../../errors';

/** A number for JSON: NaN (not evaluated) becomes 0, as the contract says. */
const finiteOrZero = (x: number): number => (Number.isFinite(x) ? x : 0);
/** A stored Float32 value in 9 significant digits: enough to read back the same Float32, half the JSON of its full float64 text. */
const float32OrZero = (x: number): number => (Number.isFinite(x) ? Number(x.toPrecision(9)) : 0);

export async function getFitExplorer(knex: Knex, fitRunId: number): Promise<ExplorerTable> {
  const run = await findFitRun(knex, fitRunId);
  if (!run) throw notFound('fit run');
  if (run.status !== 'succeeded' || run.result_json === null) {
    throw new AppError(409, 'no_residuals', `fit run ${fitRunId} has no explorer data (status ${run.status})`);
  }
  const row = (await knex('fit_explorer_columns').where({ fit_run_id: fitRunId }).first()) as EncodedExplorerColumns | undefined;
  if (!row) {
    throw new AppError(404, 'explorer_not_stored', `fit run ${fitRunId} was fitted before explorer data were stored; re-run the fit (recompute) to explore it`);
  }
  const c = decodeExplorerColumns(row);
  const result = JSON.parse(run.result_json) as FitResult;
  const flag = (bit: number) => Array.from(c.flags, (f) => (f & bit) !== 0);
  const evaluated = flag(EXPLORER_FLAG_EVALUATED);
  const list = (a: Float64Array) => Array.from(a, finiteOrZero);
  return {
    fitRunId,
    pulsarId: run.pulsar_id,
    revisionId: run.revision_id,
    count: c.count,
    toaId: Array.from(c.toaIds),
    batchId: Array.from(c.batchIds),
    batchRow: Array.from(c.batchRows),
    mjd: c.mjd,
    observatory: c.observatory,
    backend: c.backend,
    frequencyMhz: Array.from(c.frequencyMhz, (f) => (f === Infinity ? null : f)),
    uncertaintyUs: list(c.uncertaintyUs),
    residualUs: Array.from(c.residualUs, (r, i) => (evaluated[i] ? r : null)),
    excluded: flag(EXPLORER_FLAG_EXCLUDED),
    evaluated,
    nearestPulse: flag(EXPLORER_FLAG_NEAREST_PULSE),
    referenceMjd: c.referenceMjd,
    barycentricDaysHi: list(c.barycentricDaysHi),
    barycentricDaysLo: list(c.barycentricDaysLo),
    delays: {
      clockS: list(c.clockS),
      ttMinusUtcS: list(c.ttMinusUtcS),
      tdbMinusTtS: list(c.tdbMinusTtS),
      roemerS: list(c.roemerS),
      shapiroS: list(c.shapiroS),
      dispersionS: list(c.dispersionS),
      backendOffsetS: list(c.backendOffsetS),
      companionsS: list(c.companionsS),
    },
    partials: c.partialPaths.map((p, j) => ({ ...p, secondsPerUnit: Array.from(c.partials[j], float32OrZero) })),
    phaseOffsetTurns: c.phaseOffsetTurns,
    spinFrequencyHz: c.spinFrequencyHz,
    weightedRmsUs: run.weighted_rms_us,
    fittedModel: result.fittedModel,
    settings: (typeof run.settings === 'string' ? JSON.parse(run.settings) : run.settings) as FitEngineSettings,
    engineSettings: result.engineSettings,
  };
}

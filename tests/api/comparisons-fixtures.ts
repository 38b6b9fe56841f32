/**
 * Stored fit runs for the comparison and audit-log tests, written straight into
 * fit_runs and fit_residuals (as the worker would), so the statistics are known
 * exactly and can be checked against hand formulas. Models are the invented
 * demo model (tests/fixtures/cli) with chosen values.
 */
import type { Knex } from 'knex';
import { FIT_ENGINE_SETTINGS, type FitParameterResult, type FitResult, type FitRunStatus } from '../../api/contracts/fit-runs';
import { encodeResidualColumns } from '../../api/db/residual-columns';
import { insertRevision } from '../../api/db/revisions';
import { parameterHandle } from '../../worker/timing/model/parameter-paths';
import { readModelFile } from '../../worker/timing/model/read-model-file';
import { writeModelFile } from '../../worker/timing/model/write-model-file';
import { demoModelJson } from '../worker/fit-run-fixtures';

/** The demo model for `pulsarName` with top-level / nested overrides (shallow per section) and a solve_for list. */
export function modelWith(
  pulsarName: string,
  solveFor: string[],
  changes: { spin?: Record<string, unknown>; astrometry?: Record<string, unknown> } = {},
): Record<string, unknown> {
  const base = demoModelJson(pulsarName) as Record<string, Record<string, unknown>> & Record<string, unknown>;
  return {
    ...base,
    spin: { ...base.spin, ...changes.spin },
    astrometry: { ...base.astrometry, ...changes.astrometry },
    solve_for: solveFor,
  };
}

/** Saves a revision row directly (the model as the engine re-writes it); returns its id. */
export async function seedRevision(knex: Knex, pulsarId: number, authorId: number, model: Record<string, unknown>, message = 'seeded'): Promise<number> {
  return insertRevision(knex, { pulsarId, parentId: null, authorId, message, modelJson: JSON.stringify(writeModelFile(readModelFile(model))) });
}

export interface SeededRun {
  pulsarId: number;
  revisionId: number;
  /** the fitted model (file JSON); its solve_for paths are the free parameters */
  fittedModel: Record<string, unknown>;
  /** σ of each solve_for path, in the path's file unit */
  uncertainties: Record<string, number>;
  chi2: number;
  toaIds: number[];
  /** effective uncertainty per TOA (µs); default 1.5 each */
  uncertaintyUs?: number[];
  status?: FitRunStatus;
  settings?: Record<string, string>;
  converged?: boolean;
  warnings?: string[];
  excludedCount?: number;
}

/** Inserts one fit run (and, when succeeded, its residual row); returns the run id. */
export async function seedFitRun(knex: Knex, spec: SeededRun): Promise<number> {
  const status = spec.status ?? 'succeeded';
  const model = readModelFile(spec.fittedModel);
  const parameters: Record<string, FitParameterResult> = {};
  for (const path of model.solveFor) {
    const handle = parameterHandle(model, path);
    const value = handle.formatValue(handle.get(model));
    parameters[path] = { value, uncertainty: spec.uncertainties[path] ?? 1, unit: handle.fileUnit, startValue: value, changeSigma: 0 };
  }
  const count = spec.toaIds.length;
  const dof = count - (model.solveFor.length + 1); // the engine fits solve_for plus a phase offset
  const result: FitResult = {
    parameters,
    chi2: spec.chi2,
    dof,
    reducedChi2: spec.chi2 / dof,
    weightedRmsUs: 1.25,
    iterations: 3,
    converged: spec.converged ?? true,
    warnings: spec.warnings ?? [],
    phaseOffsetTurns: 0.001,
    conditionNumber: 10,
    engineSettings: {},
    fittedModel: writeModelFile(model),
  };
  const succeeded = status === 'succeeded';
  const [id] = await knex('fit_runs').insert({
    pulsar_id: spec.pulsarId,
    revision_id: spec.revisionId,
    inputs_hash: 'c'.repeat(64),
    settings: JSON.stringify(spec.settings ?? FIT_ENGINE_SETTINGS),
    status,
    stage: status,
    toa_count: count,
    excluded_count: spec.excludedCount ?? 0,
    result_json: succeeded ? JSON.stringify(result) : null,
    chi2: succeeded ? result.chi2 : null,
    reduced_chi2: succeeded ? result.reducedChi2 : null,
    weighted_rms_us: succeeded ? result.weightedRmsUs : null,
    finished_at: status === 'queued' || status === 'running' ? null : knex.fn.now(3),
  });
  const fitRunId = Number(id);
  if (succeeded) {
    const columns = encodeResidualColumns({
      count,
      toaIds: Float64Array.from(spec.toaIds),
      mjd: spec.toaIds.map((_, i) => String(58200 + i)),
      residualUs: new Float64Array(count),
      uncertaintyUs: Float64Array.from(spec.uncertaintyUs ?? spec.toaIds.map(() => 1.5)),
      frequencyMhz: new Float64Array(count).fill(1400),
      backend: spec.toaIds.map(() => 'be'),
      observatory: spec.toaIds.map(() => 'obs'),
    });
    await knex('fit_residuals').insert({ fit_run_id: fitRunId, ...columns });
  }
  return fitRunId;
}

/** TOA ids 1000…1000+n−1 (fit_residuals keeps ids without a foreign key, so they need not exist). */
export const toaIdRange = (n: number, from = 1000): number[] => Array.from({ length: n }, (_, i) => from + i);

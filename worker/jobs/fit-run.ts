/**
 * BullMQ processor `fit-run`: fits one pulsar with one model revision over its
 * current TOA selection and stores the outputs.
 *
 * Notes:
 * 1. Stages (job progress and the fit_runs row): 'loading TOAs', 'barycentring',
 *    'fitting: iteration k', 'storing results'. At each report the row's status
 *    is read back; a run cancelled meanwhile stops (UnrecoverableError
 *    'cancelled') without touching the status or storing anything.
 * 2. Exactly once: every output (the one fit_residuals row, the one
 *    fit_explorer_columns row, result and
 *    statistics on fit_runs, status 'succeeded') is written in ONE transaction,
 *    delete-then-insert keyed by the run id, and only while the run is still
 *    'running'. A job re-run after a crash (stall detection) redoes the fit and
 *    commits once; a re-run that finds the run already succeeded returns at once.
 * 3. Engine input errors (TimingInputError) mark the run failed with the
 *    engine's message and are not retried. Anything else (database, Redis) is
 *    thrown for BullMQ to retry with the queue's backoff; the last attempt
 *    marks the run failed.
 * 4. A fit that does not converge is stored as succeeded with converged=false
 *    and the engine's warning naming the last χ² (result.warnings), never hidden.
 * 5. The engine runs in a worker thread (fit-run-thread.ts), so BullMQ's lock
 *    renewal and the cancel checks go on while it computes.
 * 6. Claim, progress, cancel, commit guard and failure marking are
 *    queued-run-lifecycle.ts, shared with the search-run job.
 */
import { UnrecoverableError, type Job } from 'bullmq';
import type { Knex } from 'knex';
import type { FitResult } from '../../api/contracts/fit-runs';
import { FitRunJob, type JobProgress } from '../../api/contracts/queues';
import { findFitRun, type FitRunRow } from '../../api/db/fit-runs';
import { loadToasForFit } from '../../api/db/load-toas-for-fit';
import { loadObservatories } from '../../api/db/observatories';
import { encodeResidualColumns } from '../../api/db/residual-columns';
import { encodeExplorerColumns } from '../../api/db/explorer-columns';
import { loadExcludedToas, loadToaBatchRows } from '../../api/db/load-explorer-toas';
import { findRevision } from '../../api/db/revisions';
import { fitInputsHash, loadFitSelection, loadStoredMjdTexts } from '../../api/services/fit-runs/fit-inputs';
import { parseObservatory } from '../timing/earth/read-observatories';
import type { FitEngineInput, FitEngineOutput } from './fit-run-engine';
import { notifyFitRunFinished } from './fit-run-events';
import { runFitInThread } from './fit-run-thread';
import { alreadySucceeded, claimRun, engineResult, failRunWhenFinal, lockRunningRow, type QueuedRunRef } from './queued-run-lifecycle';
import { buildExplorerColumns } from './fit-run-explorer-columns';

export interface FitRunDeps {
  knex: Knex;
}

export interface FitRunJobResult {
  fitRunId: number;
  status: 'succeeded';
  reusedEarlierCommit: boolean; // true when an earlier attempt had already committed the outputs
}

const MAX_ITERATIONS = 20; // the engine's default (fitGaussNewton), used for the progress scale

const runRef = (fitRunId: number): QueuedRunRef => ({ table: 'fit_runs', label: 'fit', id: fitRunId });

export async function processFitRun(job: Job, deps: FitRunDeps): Promise<FitRunJobResult> {
  const parsed = FitRunJob.safeParse(job.data);
  if (!parsed.success) throw new UnrecoverableError(`fit-run: bad payload: ${parsed.error.issues[0]?.message}`);
  const { fitRunId } = parsed.data;
  const { knex } = deps;

  const run = await findFitRun(knex, fitRunId);
  if (alreadySucceeded(runRef(fitRunId), run)) return { fitRunId, status: 'succeeded', reusedEarlierCommit: true };
  const found = run as FitRunRow;
  return failRunWhenFinal(job, knex, runRef(fitRunId), () => fitAndStore(job, knex, found), () =>
    notifyFitRunFinished({ fitRunId, pulsarId: found.pulsar_id, campaignId: found.campaign_id, status: 'failed' }),
  );
}

async function fitAndStore(job: Job, knex: Knex, run: FitRunRow): Promise<FitRunJobResult> {
  const fitRunId = run.id;
  const { startedAtMs, report } = await claimRun(job, knex, runRef(fitRunId));

  const inputs = await knex.transaction(async (trx) => {
    const revision = await findRevision(trx as unknown as Knex, run.revision_id);
    if (!revision) throw new UnrecoverableError(`fit-run: revision ${run.revision_id} does not exist`);
    const loaded = await loadToasForFit(trx as unknown as Knex, run.pulsar_id);
    const selection = await loadFitSelection(trx, run.pulsar_id);
    const mjdTexts = await loadStoredMjdTexts(trx, run.pulsar_id);
    const excluded = await loadExcludedToas(trx as unknown as Knex, run.pulsar_id); // for the explorer, evaluated not fitted
    const batchRows = await loadToaBatchRows(trx as unknown as Knex, run.pulsar_id);
    // Only the sites these TOAs use: an unrelated observatory row can never fail this fit.
    const usedCodes = new Set([...loaded.toas, ...excluded.toas].map((toa) => toa.observatory));
    const observatories = (await loadObservatories(trx as unknown as Knex))
      .filter((o) => usedCodes.has(o.code))
      .map((o) => parseObservatory(o));
    return { revision, loaded, selection, mjdTexts, observatories, excluded, batchRows };
  });
  // The stored hash describes what is fitted now (TOAs may have changed since the run was queued).
  const inputsHash = fitInputsHash(inputs.revision.model_json, inputs.selection);
  await knex('fit_runs')
    .where({ id: fitRunId })
    .update({ inputs_hash: inputsHash, toa_count: inputs.loaded.toas.length, excluded_count: inputs.loaded.excludedIds.length });

  const engineInput: FitEngineInput = {
    modelJson: JSON.parse(inputs.revision.model_json) as Record<string, unknown>,
    toas: inputs.loaded.toas,
    observatories: inputs.observatories,
    maxIterations: MAX_ITERATIONS,
    excludedToas: inputs.excluded.toas,
  };
  const thread = runFitInThread(engineInput, async (event) => {
    if (event.type === 'stage') await report(event.stage === 'barycentring' ? 5 : 30, event.stage === 'barycentring' ? 'barycentring' : 'fitting: iteration 1');
    else await report(Math.min(90, 30 + (60 * event.iteration) / MAX_ITERATIONS), `fitting: iteration ${event.iteration + 1}`);
  });
  const output: FitEngineOutput = await engineResult(thread);
  await report(95, 'storing results');

  const { toas, toaIds } = inputs.loaded;
  const residuals = encodeResidualColumns({
    count: toas.length,
    toaIds: Float64Array.from(toaIds),
    mjd: toaIds.map((id) => inputs.mjdTexts.get(id) ?? ''),
    residualUs: output.residualUs,
    uncertaintyUs: output.uncertaintyUs,
    frequencyMhz: Float64Array.from(toas, (t) => t.frequencyMhz),
    backend: toas.map((t) => t.backend),
    observatory: toas.map((t) => t.observatory),
  });
  const explorer = encodeExplorerColumns(
    buildExplorerColumns(
      output.explorer,
      { fitted: inputs.loaded, excluded: inputs.excluded, mjdTexts: inputs.mjdTexts, batchRows: inputs.batchRows },
      output.phaseOffsetTurns,
    ),
  );
  const result: FitResult = {
    parameters: output.parameters,
    chi2: output.chi2,
    dof: output.dof,
    reducedChi2: output.reducedChi2,
    weightedRmsUs: output.weightedRmsUs,
    iterations: output.iterations,
    converged: output.converged,
    warnings: output.warnings,
    phaseOffsetTurns: output.phaseOffsetTurns,
    conditionNumber: output.conditionNumber,
    engineSettings: output.engineSettings,
    fittedModel: output.fittedModel,
  };
  const finishedAtMs = Date.now();
  await knex.transaction(async (trx) => {
    await lockRunningRow(trx, runRef(fitRunId));
    await trx('fit_residuals').where({ fit_run_id: fitRunId }).del();
    await trx('fit_residuals').insert({ fit_run_id: fitRunId, ...residuals });
    await trx('fit_explorer_columns').where({ fit_run_id: fitRunId }).del();
    await trx('fit_explorer_columns').insert({ fit_run_id: fitRunId, ...explorer });
    await trx('fit_runs')
      .where({ id: fitRunId })
      .update({
        status: 'succeeded',
        progress_percent: 100,
        stage: 'done',
        finished_at: new Date(finishedAtMs),
        duration_ms: finishedAtMs - startedAtMs,
        result_json: JSON.stringify(result),
        chi2: finite(output.chi2),
        reduced_chi2: finite(output.reducedChi2),
        weighted_rms_us: finite(output.weightedRmsUs),
        error_message: null,
      });
  });
  await job.updateProgress({ percent: 100, stage: 'done' } satisfies JobProgress);
  await notifyFitRunFinished({ fitRunId, pulsarId: run.pulsar_id, campaignId: run.campaign_id, status: 'succeeded' });
  return { fitRunId, status: 'succeeded', reusedEarlierCommit: false };
}

const finite = (x: number): number | null => (Number.isFinite(x) ? x : null);

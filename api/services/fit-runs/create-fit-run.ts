/**
 * Queues a fit of one pulsar with one model revision over its current TOA
 * selection — or, when a succeeded run has the same inputs hash and
 * `recompute` is not set, offers that run instead (nothing is queued).
 * The API never fits; the worker's `fit-run` job does (worker/jobs/fit-run.ts).
 */
import type { Queue } from 'bullmq';
import type { Knex } from 'knex';
import { FIT_ENGINE_SETTINGS, type FitRun } from '../../contracts/fit-runs';
import { JOB_TYPES, type FitRunJob } from '../../contracts/queues';
import { findFitRun, presentFitRuns, type FitRunRow } from '../../db/fit-runs';
import { enqueueRun, findReusableRun, loadRevisionOfPulsar } from '../queued-runs/queue-run';
import { fitInputsHash, loadFitSelection } from './fit-inputs';

export interface CreateFitRunInput {
  pulsarId: number;
  revisionId: number;
  requestedBy: number | null;
  recompute?: boolean;
  campaignId?: number | null;
  /** BullMQ parent job (a campaign job waiting for its fits as children), passed to queue.add */
  parent?: { id: string; queue: string };
}

/** The BullMQ job id of a run's job (one job per run, so queueing twice is a no-op). */
export const fitRunJobId = (fitRunId: number): string => `fit-run-${fitRunId}`;

/**
 * @returns `{ fitRun, reused }`: the new queued run (reused false) or the earlier
 *          succeeded run with identical inputs (reused true)
 * Throws 404 for an unknown pulsar or revision; 400 (path revisionId) for a
 * revision of another pulsar. When queueing fails the run is marked failed and
 * the error is rethrown.
 */
export async function createFitRun(deps: { knex: Knex; queue: Queue }, input: CreateFitRunInput): Promise<{ fitRun: FitRun; reused: boolean }> {
  const { knex, queue } = deps;
  const revision = await loadRevisionOfPulsar(knex, input.pulsarId, input.revisionId);

  const selection = await loadFitSelection(knex, input.pulsarId);
  const inputsHash = fitInputsHash(revision.model_json, selection);
  if (input.recompute !== true) {
    const earlier = await findReusableRun<FitRunRow>(knex, 'fit_runs', input.pulsarId, inputsHash);
    if (earlier) return { fitRun: (await presentFitRuns(knex, [earlier]))[0], reused: true };
  }

  const [id] = await knex('fit_runs').insert({
    pulsar_id: input.pulsarId,
    revision_id: input.revisionId,
    campaign_id: input.campaignId ?? null,
    inputs_hash: inputsHash,
    settings: JSON.stringify(FIT_ENGINE_SETTINGS),
    status: 'queued',
    stage: 'queued',
    requested_by: input.requestedBy,
    toa_count: selection.included.length,
    excluded_count: selection.excludedIds.length,
  });
  const fitRunId = Number(id);
  const payload: FitRunJob = { fitRunId };
  await enqueueRun(knex, queue, {
    table: 'fit_runs',
    id: fitRunId,
    jobId: fitRunJobId(fitRunId),
    jobType: JOB_TYPES.fitRun,
    payload,
    options: input.parent ? { parent: input.parent } : {},
    what: 'fit',
  });
  const row = await findFitRun(knex, fitRunId);
  if (!row) throw new Error(`fit run ${fitRunId} vanished after insert`);
  return { fitRun: (await presentFitRuns(knex, [row]))[0], reused: false };
}

/**
 * Queues a companion search of one pulsar with one model revision over its
 * current TOA selection — or, when a succeeded search has the same inputs hash
 * and `recompute` is not set, offers that run instead (nothing is queued).
 * The API never searches; the worker's `search-run` job does (worker/jobs/search-run.ts).
 */
import type { Queue } from 'bullmq';
import type { Knex } from 'knex';
import { SEARCH_RUN_JOB_TYPE, type SearchRunJob } from '../../contracts/queues';
import { SEARCH_ENGINE_SETTINGS, type CreateSearchRunBody, type SearchRun } from '../../contracts/search-runs';
import { findRevision } from '../../db/revisions';
import { findSearchRun, presentSearchRuns, type SearchRunRow } from '../../db/search-runs';
import { fieldError, notFound } from '../../errors';
import { loadFitSelection } from '../fit-runs/fit-inputs';
import { resolveSearchOptions, searchInputsHash } from './search-inputs';

export interface CreateSearchRunInput extends CreateSearchRunBody {
  pulsarId: number;
  requestedBy: number | null;
}

/** The BullMQ job id of a run's job (one job per run, so queueing twice is a no-op). */
export const searchRunJobId = (searchRunId: number): string => `search-run-${searchRunId}`;

/**
 * @returns `{ searchRun, reused }`: the new queued run (reused false) or the
 *          earlier succeeded run with identical inputs (reused true)
 * Throws 404 for an unknown pulsar or revision; 400 (path revisionId) for a
 * revision of another pulsar. When queueing fails the run is marked failed and
 * the error is rethrown.
 */
export async function createSearchRun(deps: { knex: Knex; queue: Queue }, input: CreateSearchRunInput): Promise<{ searchRun: SearchRun; reused: boolean }> {
  const { knex, queue } = deps;
  const pulsar = await knex('pulsars').where({ id: input.pulsarId }).first('id');
  if (!pulsar) throw notFound('pulsar');
  const revision = await findRevision(knex, input.revisionId);
  if (!revision) throw notFound('revision');
  if (revision.pulsar_id !== input.pulsarId) throw fieldError(['revisionId'], 'not a revision of this pulsar');

  const options = resolveSearchOptions(input);
  const selection = await loadFitSelection(knex, input.pulsarId);
  const inputsHash = searchInputsHash(revision.model_json, selection, options);
  if (input.recompute !== true) {
    const earlier = (await knex('search_runs')
      .where({ inputs_hash: inputsHash, status: 'succeeded', pulsar_id: input.pulsarId })
      .orderBy('id', 'desc')
      .first()) as SearchRunRow | undefined;
    if (earlier) return { searchRun: (await presentSearchRuns(knex, [earlier]))[0], reused: true };
  }

  const [id] = await knex('search_runs').insert({
    pulsar_id: input.pulsarId,
    revision_id: input.revisionId,
    inputs_hash: inputsHash,
    options: JSON.stringify(options),
    settings: JSON.stringify(SEARCH_ENGINE_SETTINGS),
    status: 'queued',
    stage: 'queued',
    requested_by: input.requestedBy,
    toa_count: selection.included.length,
    excluded_count: selection.excludedIds.length,
  });
  const searchRunId = Number(id);
  const jobId = searchRunJobId(searchRunId);
  await knex('search_runs').where({ id: searchRunId }).update({ job_id: jobId });
  const payload: SearchRunJob = { searchRunId };
  try {
    await queue.add(SEARCH_RUN_JOB_TYPE, payload, { jobId });
  } catch (error) {
    await knex('search_runs')
      .where({ id: searchRunId })
      .update({ status: 'failed', stage: 'not queued', error_message: `could not queue the search: ${(error as Error).message}`, finished_at: knex.fn.now(3) });
    throw error;
  }
  const row = await findSearchRun(knex, searchRunId);
  if (!row) throw new Error(`search run ${searchRunId} vanished after insert`);
  return { searchRun: (await presentSearchRuns(knex, [row]))[0], reused: false };
}

/**
 * Queues a companion search of one pulsar with one model revision over its
 * current TOA selection — or, when a succeeded search has the same inputs hash
 * and `recompute` is not set, offers that run instead (nothing is queued).
 * The API never searches; the worker's `search-run` job does (worker/jobs/search-run.ts).
 */
import type { Queue } from 'bullmq';
import type { Knex } from 'knex';
import { SEARCH_RUN_JOB_TYPE, type SearchRunJob } from '../../contracts/queues';
import { MAX_SEARCH_FREQUENCIES, SEARCH_ENGINE_SETTINGS, type CreateSearchRunBody, type SearchOptions, type SearchRun } from '../../contracts/search-runs';
import { findSearchRun, presentSearchRuns, type SearchRunRow } from '../../db/search-runs';
import { fieldError } from '../../errors';
import { loadFitSelection } from '../fit-runs/fit-inputs';
import { enqueueRun, findReusableRun, loadRevisionOfPulsar } from '../queued-runs/queue-run';
import { resolveSearchOptions, searchInputsHash } from './search-inputs';

export interface CreateSearchRunInput extends CreateSearchRunBody {
  pulsarId: number;
  requestedBy: number | null;
}

/** Points per natural resolution 1/span of the engine's frequency grid (periodogramGrid's default). */
const GRID_OVERSAMPLING = 5;

/**
 * Refuses a minimum period so short that the grid would exceed MAX_SEARCH_FREQUENCIES
 * over the span of the pulsar's TOAs (day numbers; the engine's own rule decides the rest).
 */
async function checkGridSize(knex: Knex, pulsarId: number, options: SearchOptions): Promise<void> {
  if (options.minPeriodDays === null) return; // the engine's default minimum (≥ 1 d) keeps the grid small
  const row = (await knex('toas').where({ pulsar_id: pulsarId }).first(knex.raw('MIN(mjd_day) AS first'), knex.raw('MAX(mjd_day) AS last'))) as
    | { first: number | null; last: number | null }
    | undefined;
  if (!row || row.first === null || row.last === null) return;
  const spanDays = Number(row.last) - Number(row.first) + 1;
  const maxPeriodDays = options.maxPeriodDays ?? spanDays;
  const count = GRID_OVERSAMPLING * spanDays * (1 / options.minPeriodDays - 1 / maxPeriodDays); // grid step 1/(5·span): periodogramGrid
  if (count > MAX_SEARCH_FREQUENCIES) {
    const shortest = 1 / (MAX_SEARCH_FREQUENCIES / (GRID_OVERSAMPLING * spanDays) + 1 / maxPeriodDays);
    throw fieldError(
      ['minPeriodDays'],
      `the trial grid would hold ${Math.round(count).toLocaleString('en')} frequencies over the ${spanDays}-day span (limit ${MAX_SEARCH_FREQUENCIES.toLocaleString('en')}); choose at least ${shortest.toPrecision(3)} days`,
    );
  }
}

/** The BullMQ job id of a run's job (one job per run, so queueing twice is a no-op). */
export const searchRunJobId = (searchRunId: number): string => `search-run-${searchRunId}`;

/**
 * @returns `{ searchRun, reused }`: the new queued run (reused false) or the
 *          earlier succeeded run with identical inputs (reused true)
 * Throws 404 for an unknown pulsar or revision; 400 (path revisionId) for a
 * revision of another pulsar; 400 (path minPeriodDays) for a grid beyond
 * MAX_SEARCH_FREQUENCIES. When queueing fails the run is marked failed and
 * the error is rethrown.
 */
export async function createSearchRun(deps: { knex: Knex; queue: Queue }, input: CreateSearchRunInput): Promise<{ searchRun: SearchRun; reused: boolean }> {
  const { knex, queue } = deps;
  const revision = await loadRevisionOfPulsar(knex, input.pulsarId, input.revisionId);

  const options = resolveSearchOptions(input);
  await checkGridSize(knex, input.pulsarId, options);
  const selection = await loadFitSelection(knex, input.pulsarId);
  const inputsHash = searchInputsHash(revision.model_json, selection, options);
  if (input.recompute !== true) {
    const earlier = await findReusableRun<SearchRunRow>(knex, 'search_runs', input.pulsarId, inputsHash);
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
  const payload: SearchRunJob = { searchRunId };
  await enqueueRun(knex, queue, { table: 'search_runs', id: searchRunId, jobId: searchRunJobId(searchRunId), jobType: SEARCH_RUN_JOB_TYPE, payload, what: 'search' });
  const row = await findSearchRun(knex, searchRunId);
  if (!row) throw new Error(`search run ${searchRunId} vanished after insert`);
  return { searchRun: (await presentSearchRuns(knex, [row]))[0], reused: false };
}

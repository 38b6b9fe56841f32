/**
 * Cancels a search run. Queued: its job is removed from the queue and the run
 * is marked cancelled. Running: the run is marked cancelled, and the job stops
 * at its next progress report (worker/jobs/search-run.ts) without storing outputs.
 */
import type { Queue } from 'bullmq';
import type { Knex } from 'knex';
import type { SearchRun } from '../../contracts/search-runs';
import { findSearchRun } from '../../db/search-runs';
import { conflict, notFound } from '../../errors';
import { getSearchRun } from './get-search-run';

/** Throws 404 for an unknown run, 409 when it is already succeeded, failed or cancelled. */
export async function cancelSearchRun(deps: { knex: Knex; queue: Queue }, searchRunId: number): Promise<SearchRun> {
  const { knex, queue } = deps;
  const row = await findSearchRun(knex, searchRunId);
  if (!row) throw notFound('search run');
  if (row.status !== 'queued' && row.status !== 'running') throw conflict(`search run ${searchRunId} is already ${row.status}`);
  if (row.status === 'queued' && row.job_id) {
    const job = await queue.getJob(row.job_id);
    // A job a worker has just taken is locked and cannot be removed; it sees the cancelled status when it starts.
    await job?.remove().catch(() => undefined);
  }
  const changed = await knex('search_runs')
    .where({ id: searchRunId })
    .whereIn('status', ['queued', 'running'])
    .update({ status: 'cancelled', stage: 'cancelled', finished_at: knex.fn.now(3) });
  if (changed === 0) {
    const now = await findSearchRun(knex, searchRunId);
    throw conflict(`search run ${searchRunId} is already ${now?.status ?? 'gone'}`);
  }
  return getSearchRun(knex, searchRunId);
}

/**
 * Cancels a fit run. Queued: its job is removed from the queue and the run is
 * marked cancelled. Running: the run is marked cancelled, and the job stops at
 * its next progress report (worker/jobs/fit-run.ts) without storing outputs.
 */
import type { Queue } from 'bullmq';
import type { Knex } from 'knex';
import type { FitRun } from '../../contracts/fit-runs';
import { findFitRun } from '../../db/fit-runs';
import { conflict, notFound } from '../../errors';
import { getFitRun } from './get-fit-run';

/** Throws 404 for an unknown run, 409 when it is already succeeded, failed or cancelled. */
export async function cancelFitRun(deps: { knex: Knex; queue: Queue }, fitRunId: number): Promise<FitRun> {
  const { knex, queue } = deps;
  const row = await findFitRun(knex, fitRunId);
  if (!row) throw notFound('fit run');
  if (row.status !== 'queued' && row.status !== 'running') throw conflict(`fit run ${fitRunId} is already ${row.status}`);
  if (row.status === 'queued' && row.job_id) {
    const job = await queue.getJob(row.job_id);
    // A job a worker has just taken is locked and cannot be removed; it sees the cancelled status when it starts.
    await job?.remove().catch(() => undefined);
  }
  const changed = await knex('fit_runs')
    .where({ id: fitRunId })
    .whereIn('status', ['queued', 'running'])
    .update({ status: 'cancelled', stage: 'cancelled', finished_at: knex.fn.now(3) });
  if (changed === 0) {
    const now = await findFitRun(knex, fitRunId);
    throw conflict(`fit run ${fitRunId} is already ${now?.status ?? 'gone'}`);
  }
  return getFitRun(knex, fitRunId);
}

/**
 * Cancels a queued or running campaign: the campaign becomes `cancelled`, its
 * fit runs that are still queued are cancelled (row and BullMQ job), and
 * pulsars not yet fanned out are marked cancelled. Fit runs already running
 * finish on their own; the campaign job sees the cancellation at its next
 * step and writes the summary of what had finished. 409 if already final.
 */
import type { Queue } from 'bullmq';
import type { Knex } from 'knex';
import { findCampaign, loadCampaignRuns, presentCampaign, type Campaign } from '../../db/campaigns';
import { conflict, notFound } from '../../errors';

export async function cancelCampaign(deps: { knex: Knex; queue: Queue }, id: number): Promise<Campaign> {
  const { knex, queue } = deps;
  const before = await findCampaign(knex, id);
  if (!before) throw notFound('campaign');
  const queuedJobIds = await retryOnDeadlock(() => knex.transaction(async (trx) => {
    const changed = await trx('campaigns')
      .where({ id })
      .whereIn('status', ['queued', 'running'])
      .update({ status: 'cancelled', progress_stage: 'cancelled', finished_at: trx.fn.now(3) });
    if (changed === 0) throw conflict(`campaign ${id} is already ${before.status}`);
    const queuedRuns: { id: number; job_id: string | null }[] = await trx('fit_runs')
      .where({ campaign_id: id, status: 'queued' })
      .forUpdate()
      .select('id', 'job_id');
    if (queuedRuns.length > 0) {
      await trx('fit_runs')
        .whereIn('id', queuedRuns.map((r) => r.id))
        .update({ status: 'cancelled', stage: 'cancelled', finished_at: trx.fn.now(3) });
    }
    await trx('campaign_runs')
      .where({ campaign_id: id })
      .where((q) => q.whereIn('status', ['pending']).orWhereIn('fit_run_id', queuedRuns.map((r) => r.id)))
      .update({ status: 'cancelled' });
    return queuedRuns.map((r) => r.job_id).filter((j): j is string => j !== null);
  }));
  // Removing a waiting job is a courtesy: the fit job also reads the row's status before it starts.
  await Promise.all(
    queuedJobIds.map(async (jobId) => {
      const job = await queue.getJob(jobId);
      await job?.remove().catch(() => undefined); // a job that just got locked by a worker cannot be removed
    }),
  );
  return presentCampaign((await findCampaign(knex, id))!, await loadCampaignRuns(knex, id));
}

/**
 * Runs a transaction again when MariaDB chose it as a deadlock victim (the
 * campaign job may be planning the same campaign's rows at that moment);
 * the rolled-back attempt left nothing behind.
 */
async function retryOnDeadlock<T>(attempt: () => Promise<T>, tries = 3): Promise<T> {
  for (let i = 1; ; i++) {
    try {
      return await attempt();
    } catch (err) {
      if ((err as { code?: string }).code !== 'ER_LOCK_DEADLOCK' || i >= tries) throw err;
    }
  }
}

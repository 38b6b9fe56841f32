/**
 * Starts a campaign: stores it (status queued) and queues its `campaign` job,
 * which resolves the pulsars and fans out the fit runs (worker/jobs/campaign.ts).
 * With notifyMe the creator is subscribed to the campaign's e-mail.
 */
import type { Queue } from 'bullmq';
import type { Knex } from 'knex';
import { CAMPAIGN_JOB_TYPE, CampaignJob } from '../../contracts/queues';
import { findCampaign, presentCampaign, type Campaign } from '../../db/campaigns';
import { fieldError } from '../../errors';

export interface CreateCampaignInput {
  name: string;
  pulsarIds: number[] | 'all';
  revisionChoice: 'latest' | 'released';
  notifyMe?: boolean;
  /** Refit even when a succeeded run has identical inputs (default: reuse it). */
  recompute?: boolean;
}

/** BullMQ job id of a campaign's job: one job per campaign, so a second add is a no-op. */
export function campaignJobId(campaignId: number): string {
  return `campaign-${campaignId}`;
}

export async function createCampaign(deps: { knex: Knex; queue: Queue }, input: CreateCampaignInput, userId: number): Promise<Campaign> {
  const { knex, queue } = deps;
  const selection = input.pulsarIds === 'all' ? 'all' : [...new Set(input.pulsarIds)].sort((a, b) => a - b);
  if (selection !== 'all') {
    const found = new Set((await knex('pulsars').whereIn('id', selection).pluck('id')).map(Number));
    const missing = selection.filter((id) => !found.has(id));
    if (missing.length > 0) throw fieldError(['pulsarIds'], `unknown pulsar ids: ${missing.join(', ')}`);
  }
  const campaignId = await knex.transaction(async (trx) => {
    const [id] = await trx('campaigns').insert({
      name: input.name,
      created_by: userId,
      revision_choice: input.revisionChoice,
      pulsar_selection: JSON.stringify(selection),
      notify_creator: input.notifyMe === true,
      recompute: input.recompute === true,
      job_id: null,
    });
    if (input.notifyMe) await trx('notification_subscriptions').insert({ user_id: userId, campaign_id: id });
    return id as number;
  });
  const jobId = campaignJobId(campaignId);
  await queue.add(CAMPAIGN_JOB_TYPE, CampaignJob.parse({ campaignId }), { jobId });
  await knex('campaigns').where({ id: campaignId }).update({ job_id: jobId });
  return presentCampaign((await findCampaign(knex, campaignId))!, []);
}

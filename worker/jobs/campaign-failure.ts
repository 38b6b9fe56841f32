/**
 * A campaign whose job failed for good (retries exhausted or bad input): the
 * campaign is marked failed with the job's message, the summary of what had
 * finished is kept, its queued fit runs are left to run (their own results
 * stay valid), and the campaign's followers are told.
 */
import type { Knex } from 'knex';
import type { MailDeps } from '../../api/app-deps';
import { syncCampaignState } from './campaign-summary';
import { notifyCampaignFinished } from './notify-campaign-finished';

export async function failCampaign(deps: { knex: Knex; mail: MailDeps }, campaignId: number, message: string): Promise<boolean> {
  const { knex } = deps;
  const state = await syncCampaignState(knex, campaignId);
  const changed = await knex('campaigns')
    .where({ id: campaignId })
    .whereIn('status', ['queued', 'running'])
    .update({
      status: 'failed',
      error_message: message.slice(0, 2000),
      summary_json: JSON.stringify(state.summary),
      progress_done: state.done,
      progress_total: state.total,
      progress_stage: 'failed',
      finished_at: knex.fn.now(3),
    });
  if (changed === 1) await notifyCampaignFinished(deps.mail, campaignId);
  return changed === 1;
}

/**
 * E-mails the followers of a campaign (its creator follows it when they asked
 * for notifyMe) once the campaign has finished, failed or been cancelled:
 * the per-pulsar summary (reduced χ² and weighted RMS before → after) and a
 * link. Called by the campaign job after the final state is committed, and by
 * the worker when the job fails for good. Never throws; failures are logged.
 */
import type { MailDeps } from '../../api/app-deps';
import { FINAL_CAMPAIGN_STATUSES, findCampaign, summaryOf } from '../../api/db/campaigns';
import { campaignFinishedEmail } from '../../api/mail/notification-emails';
import { sendEach } from './notify-fit-run-finished';

export async function notifyCampaignFinished(deps: MailDeps, campaignId: number): Promise<string[]> {
  try {
    const campaign = await findCampaign(deps.knex, campaignId);
    if (!campaign || !FINAL_CAMPAIGN_STATUSES.includes(campaign.status)) return [];
    const recipients: string[] = await deps.knex('notification_subscriptions as s').join('users as u', 'u.id', 's.user_id')
      .where({ 's.campaign_id': campaignId, 'u.active': true }).orderBy('u.id').pluck('u.email');
    if (recipients.length === 0) return [];
    const facts = {
      campaignId,
      name: campaign.name,
      status: campaign.status as 'succeeded' | 'failed' | 'cancelled',
      errorMessage: campaign.error_message,
      summary: summaryOf(campaign) ?? [],
      link: `${deps.publicUrl}/campaigns/${campaignId}`,
    };
    return await sendEach(deps, recipients, (to) => campaignFinishedEmail(to, facts), `campaign ${campaignId}`);
  } catch (err) {
    deps.log(`notification for campaign ${campaignId} not sent`, err);
    return [];
  }
}

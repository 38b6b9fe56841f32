/** The caller's e-mail subscriptions: pulsar ids and campaign ids. */
import type { Knex } from 'knex';

export async function listSubscriptions(knex: Knex, userId: number): Promise<{ pulsarIds: number[]; campaignIds: number[] }> {
  const rows: { pulsar_id: number | null; campaign_id: number | null }[] = await knex('notification_subscriptions')
    .where({ user_id: userId })
    .orderBy('id')
    .select('pulsar_id', 'campaign_id');
  return {
    pulsarIds: rows.filter((r) => r.pulsar_id !== null).map((r) => Number(r.pulsar_id)),
    campaignIds: rows.filter((r) => r.campaign_id !== null).map((r) => Number(r.campaign_id)),
  };
}

/**
 * Subscribes or unsubscribes a user to the e-mails of one pulsar (every fit
 * run of it) or one campaign. Idempotent: subscribing twice keeps one row.
 * 404 if the pulsar or campaign does not exist.
 */
import type { Knex } from 'knex';
import { notFound } from '../../errors';

export type SubscriptionTarget = { kind: 'pulsar'; id: number } | { kind: 'campaign'; id: number };

export async function setSubscription(
  knex: Knex,
  userId: number,
  target: SubscriptionTarget,
  subscribed: boolean,
): Promise<{ subscribed: boolean }> {
  const table = target.kind === 'pulsar' ? 'pulsars' : 'campaigns';
  const column = target.kind === 'pulsar' ? 'pulsar_id' : 'campaign_id';
  if (!(await knex(table).where({ id: target.id }).first('id'))) throw notFound(target.kind);
  if (subscribed) {
    await knex('notification_subscriptions').insert({ user_id: userId, [column]: target.id }).onConflict().ignore();
  } else {
    await knex('notification_subscriptions').where({ user_id: userId, [column]: target.id }).delete();
  }
  return { subscribed };
}

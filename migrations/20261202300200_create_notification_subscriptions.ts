/**
 * E-mail opt-ins: a user follows one pulsar (every fit run of it) or one
 * campaign. Exactly one of pulsar_id / campaign_id is set; unique per user and target.
 */
import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('notification_subscriptions', (t) => {
    t.increments('id').primary();
    t.integer('user_id').unsigned().notNullable().references('users.id').onDelete('CASCADE');
    t.integer('pulsar_id').unsigned().nullable().references('pulsars.id').onDelete('CASCADE');
    t.integer('campaign_id').unsigned().nullable().references('campaigns.id').onDelete('CASCADE');
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.unique(['user_id', 'pulsar_id'], { indexName: 'notification_subs_user_pulsar_uq' });
    t.unique(['user_id', 'campaign_id'], { indexName: 'notification_subs_user_campaign_uq' });
  });
  // One target per row (MariaDB enforces CHECK constraints since 10.2).
  await knex.raw(
    'ALTER TABLE notification_subscriptions ADD CONSTRAINT notification_subs_one_target_ck CHECK ((pulsar_id IS NULL) <> (campaign_id IS NULL))',
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('notification_subscriptions');
}

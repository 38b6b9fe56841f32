/**
 * Who did what: one row per audited action ('toa-batch.delete', 'toas.exclude',
 * 'toas.restore', …) with its details. Rows outlive the pulsar and the user
 * they mention (those references become NULL).
 */
import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('audit_log', (t) => {
    t.bigIncrements('id').primary();
    t.integer('pulsar_id').unsigned().nullable().references('pulsars.id').onDelete('SET NULL');
    t.integer('user_id').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.string('action', 64).notNullable();
    t.json('details').notNullable();
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['pulsar_id', 'created_at'], 'audit_log_pulsar_created_idx');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('audit_log');
}

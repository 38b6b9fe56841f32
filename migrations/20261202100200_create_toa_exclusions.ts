/**
 * Arrival times left out of fits. Reversible with history: restoring fills
 * restored_by/restored_at and keeps the row. A TOA is excluded while it has a
 * row with restored_at NULL (at most one such row at a time).
 */
import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('toa_exclusions', (t) => {
    t.increments('id').primary();
    t.bigInteger('toa_id').unsigned().notNullable().references('toas.id').onDelete('CASCADE');
    t.integer('pulsar_id').unsigned().notNullable().references('pulsars.id').onDelete('CASCADE');
    t.string('reason', 500).notNullable();
    t.integer('excluded_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.datetime('excluded_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.integer('restored_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.datetime('restored_at', { precision: 3 }).nullable();
    t.index(['pulsar_id', 'restored_at'], 'toa_exclusions_pulsar_restored_idx');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('toa_exclusions');
}

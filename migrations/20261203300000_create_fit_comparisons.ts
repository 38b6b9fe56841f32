/**
 * Saved fit comparisons: 2–4 fit runs of one pulsar (reference run first) with
 * a comment and who saved it. The comparison itself is recomputed from the
 * runs' stored results whenever it is read, so only the choice is kept here.
 */
import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('fit_comparisons', (t) => {
    t.increments('id').primary();
    t.integer('pulsar_id').unsigned().notNullable().references('pulsars.id').onDelete('CASCADE');
    t.json('fit_run_ids').notNullable(); // JSON array of fit_runs.id, reference first
    t.text('comment').notNullable();
    t.integer('created_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['pulsar_id', 'id'], 'fit_comparisons_pulsar_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('fit_comparisons');
}

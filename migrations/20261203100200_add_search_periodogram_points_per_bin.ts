/**
 * search_periodograms.points_per_bin: 1 when every grid frequency is stored;
 * k > 1 when a periodogram longer than the storage limit is kept max-pooled
 * (each stored power is the highest of k consecutive grid frequencies, and
 * step_per_day is then k grid steps), so peaks survive in a bounded row.
 */
import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('search_periodograms', (t) => {
    t.integer('points_per_bin').unsigned().notNullable().defaultTo(1);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('search_periodograms', (t) => {
    t.dropColumn('points_per_bin');
  });
}

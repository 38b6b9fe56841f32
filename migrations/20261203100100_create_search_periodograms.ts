/**
 * The residual periodogram of each round of a finished search run: the regular
 * frequency grid (f_k = min_frequency_per_day + k·step_per_day, k < count) and
 * the power at each grid frequency as a compressed Float64 column
 * (api/db/residual-columns.ts encodeFloat64Column). One row per run and round.
 */
import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('search_periodograms', (t) => {
    t.integer('search_run_id').unsigned().notNullable().references('search_runs.id').onDelete('CASCADE');
    t.integer('round').unsigned().notNullable(); // 1-based
    t.double('min_frequency_per_day').notNullable();
    t.double('step_per_day').notNullable();
    t.integer('count').unsigned().notNullable();
    t.specificType('power', 'LONGBLOB').notNullable(); // Float64 little-endian, deflated
    t.primary(['search_run_id', 'round']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('search_periodograms');
}

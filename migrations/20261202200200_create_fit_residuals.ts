/**
 * Per-TOA residuals of a finished fit run, one row per run, stored as
 * compressed columns (api/db/residual-columns.ts: typed arrays or text →
 * zlib deflate). The run id is the primary key, so a run can never have two
 * sets of residuals. The row is self-contained (MJD text, frequency, backend,
 * observatory included), so it still reads after its TOAs are deleted.
 */
import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('fit_residuals', (t) => {
    t.integer('fit_run_id').unsigned().primary().references('fit_runs.id').onDelete('CASCADE');
    t.integer('count').unsigned().notNullable();
    t.specificType('toa_ids', 'LONGBLOB').notNullable(); // Int32 little-endian
    t.specificType('mjd', 'LONGBLOB').notNullable(); // decimal MJD text, one per line
    t.specificType('residual_us', 'LONGBLOB').notNullable(); // Float64 little-endian
    t.specificType('uncertainty_us', 'LONGBLOB').notNullable(); // Float64, effective uncertainty of the fit
    t.specificType('frequency_mhz', 'LONGBLOB').notNullable(); // Float64, Infinity for infinite frequency
    t.specificType('backend', 'LONGBLOB').notNullable(); // dictionary: labels JSON + Int32 indexes
    t.specificType('observatory', 'LONGBLOB').notNullable(); // dictionary, as backend
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('fit_residuals');
}

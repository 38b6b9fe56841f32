/**
 * One row per arrival time. The MJD is stored losslessly as integer day plus
 * DECIMAL(39,38) fraction: the file's fractional digits are kept exactly up to
 * 38 digits (more are rounded half to even at the 38th). A NULL frequency
 * means infinite frequency (`inf` in the file).
 */
import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('toas', (t) => {
    t.bigIncrements('id').primary();
    t.integer('pulsar_id').unsigned().notNullable().references('pulsars.id').onDelete('CASCADE');
    t.integer('batch_id').unsigned().notNullable().references('toa_batches.id').onDelete('CASCADE');
    t.integer('row_number').unsigned().notNullable(); // 1-based data row of the file
    t.integer('line_number').unsigned().notNullable(); // 1-based physical line of the file
    t.integer('mjd_day').notNullable();
    t.decimal('mjd_fraction', 39, 38).notNullable(); // 0 ≤ fraction < 1, exact decimal digits
    t.double('uncertainty_us').notNullable();
    t.double('frequency_mhz').nullable(); // NULL = infinite frequency
    t.string('observatory', 16).notNullable();
    t.string('backend', 64).notNullable();
    t.bigInteger('pulse_number').nullable();
    t.json('labels').nullable(); // unknown columns of the file, verbatim; NULL when none
    t.index(['pulsar_id', 'mjd_day', 'mjd_fraction'], 'toas_pulsar_mjd_idx');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('toas');
}

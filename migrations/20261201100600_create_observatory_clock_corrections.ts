/**
 * Clock-correction points of an observatory. The epoch is split into integer
 * MJD day + an exact decimal fraction of the day (28 digits), so the MJD text
 * an administrator entered comes back unchanged.
 */
import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('observatory_clock_corrections', (t) => {
    t.increments('id').primary();
    t.integer('observatory_id').unsigned().notNullable().references('observatories.id').onDelete('CASCADE');
    t.integer('mjd_day').notNullable();
    t.decimal('mjd_fraction', 30, 28).notNullable(); // in [0, 1)
    t.double('correction_us').notNullable();
    t.unique(['observatory_id', 'mjd_day', 'mjd_fraction'], { indexName: 'clock_corrections_epoch_unique' });
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('observatory_clock_corrections');
}

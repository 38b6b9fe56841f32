/**
 * pulsars.first_mjd / last_mjd grow from 40 to 48 characters: a stored MJD
 * has a day number, a point and up to 38 fractional digits (toas.mjd_fraction
 * is DECIMAL(39,38)), which does not fit in 40.
 */
import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('pulsars', (t) => {
    t.string('first_mjd', 48).nullable().alter();
    t.string('last_mjd', 48).nullable().alter();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('pulsars', (t) => {
    t.string('first_mjd', 40).nullable().alter();
    t.string('last_mjd', 40).nullable().alter();
  });
}

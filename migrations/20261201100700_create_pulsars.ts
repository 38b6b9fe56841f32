/**
 * Pulsars with their catalogue position (sexagesimal text as entered) and the
 * TOA statistics that the toa-statistics job recomputes (no TOA table yet).
 */
import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('pulsars', (t) => {
    t.increments('id').primary();
    t.string('name', 32).notNullable().unique();
    t.string('ra_hms', 32).notNullable();
    t.string('dec_dms', 32).notNullable();
    t.integer('created_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.integer('toa_count').unsigned().notNullable().defaultTo(0);
    t.string('first_mjd', 40).nullable(); // decimal MJD text, never a float
    t.string('last_mjd', 40).nullable();
    t.json('observatories').nullable(); // array of observatory codes
    t.datetime('statistics_updated_at', { precision: 3 }).nullable();
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.datetime('updated_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('pulsars');
}

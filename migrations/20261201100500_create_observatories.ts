/** Registered observatories: ITRF geocentric position in metres. */
import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('observatories', (t) => {
    t.increments('id').primary();
    t.string('code', 16).notNullable().unique();
    t.string('name', 200).notNullable();
    t.double('itrf_x_m').notNullable();
    t.double('itrf_y_m').notNullable();
    t.double('itrf_z_m').notNullable();
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.datetime('updated_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('observatories');
}

/** Accounts of the group: one role each, argon2id password hash, deactivation instead of deletion. */
import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('users', (t) => {
    t.increments('id').primary();
    t.string('email', 320).notNullable().unique(); // stored lower-case
    t.string('display_name', 100).notNullable();
    t.enu('role', ['viewer', 'observer', 'analyst', 'lead', 'admin']).notNullable();
    t.string('password_hash', 255).notNullable();
    t.boolean('active').notNullable().defaultTo(true);
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.datetime('updated_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('users');
}

/** Password-reset requests; only the SHA-256 hash of the e-mailed token is kept. */
import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('password_resets', (t) => {
    t.increments('id').primary();
    t.integer('user_id').unsigned().notNullable().references('users.id').onDelete('CASCADE');
    t.specificType('token_sha256', 'CHAR(64)').notNullable().unique();
    t.datetime('expires_at', { precision: 3 }).notNullable();
    t.datetime('used_at', { precision: 3 }).nullable();
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('password_resets');
}

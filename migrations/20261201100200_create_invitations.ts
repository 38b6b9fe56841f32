/** Invitations e-mailed by an administrator; only the SHA-256 hash of the token is kept. */
import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('invitations', (t) => {
    t.increments('id').primary();
    t.string('email', 320).notNullable();
    t.enu('role', ['viewer', 'observer', 'analyst', 'lead', 'admin']).notNullable();
    t.specificType('token_sha256', 'CHAR(64)').notNullable().unique();
    t.integer('invited_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.datetime('expires_at', { precision: 3 }).notNullable();
    t.datetime('accepted_at', { precision: 3 }).nullable();
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['email']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('invitations');
}

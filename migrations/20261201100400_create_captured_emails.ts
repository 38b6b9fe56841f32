/** Mail captured by the local SMTP sink (dev/test profiles), read by admins at GET /api/outbox. */
import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('captured_emails', (t) => {
    t.increments('id').primary();
    t.string('to_addresses', 2000).notNullable(); // envelope recipients, comma-separated
    t.string('subject', 1000).notNullable();
    t.text('text_body', 'longtext').nullable();
    t.text('html_body', 'longtext').nullable();
    t.integer('raw_size_bytes').unsigned().notNullable();
    t.datetime('received_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('captured_emails');
}

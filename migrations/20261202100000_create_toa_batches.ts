/**
 * One row per uploaded arrival-time file: who sent it, its SHA-256 (duplicate
 * uploads of a pulsar are recognised by it), how many rows, the time span and
 * the observatories and backends seen. Deleting a pulsar deletes its batches.
 */
import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('toa_batches', (t) => {
    t.increments('id').primary();
    t.integer('pulsar_id').unsigned().notNullable().references('pulsars.id').onDelete('CASCADE');
    t.string('file_name', 255).notNullable();
    t.integer('uploaded_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.specificType('checksum_sha256', 'CHAR(64)').notNullable(); // lower-case hex
    t.integer('row_count').unsigned().notNullable();
    t.string('first_mjd', 48).notNullable(); // decimal MJD text (day + up to 38 fractional digits), never a float
    t.string('last_mjd', 48).notNullable();
    t.json('observatories').notNullable(); // array of codes, sorted
    t.json('backends').notNullable(); // array of backend labels, sorted
    t.string('status', 16).notNullable().defaultTo('stored');
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['pulsar_id', 'checksum_sha256'], 'toa_batches_pulsar_checksum_idx');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('toa_batches');
}

/**
 * Model revisions: one saved timing-model file (docs/formats.md §2) per row,
 * exactly as the engine re-wrote it (readModelFile → writeModelFile). Rows are
 * immutable once saved; only the release columns change (a lead releases a
 * revision or withdraws the release).
 */
import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('model_revisions', (t) => {
    t.increments('id').primary();
    t.integer('pulsar_id').unsigned().notNullable().references('pulsars.id').onDelete('CASCADE');
    t.integer('parent_id').unsigned().nullable().references('model_revisions.id').onDelete('SET NULL');
    t.integer('author_id').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.string('message', 500).notNullable();
    t.specificType('model_json', 'LONGTEXT').notNullable();
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.datetime('released_at', { precision: 3 }).nullable();
    t.integer('released_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.string('release_note', 500).nullable();
    t.index(['pulsar_id', 'id'], 'model_revisions_pulsar_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('model_revisions');
}

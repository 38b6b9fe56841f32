/**
 * Companion-search runs: the inputs of one queued search (model revision, TOA
 * selection, search options and engine settings, summarised by `inputs_hash`),
 * its progress and timings, and its outputs: result_json (peaks with their
 * false-alarm probabilities, candidates with elements ± uncertainties and
 * derived masses, the final fit and the resulting model) plus the listing
 * columns. `saved_revision_id` is the revision an analyst saved from the
 * resulting model. The periodograms are in search_periodograms (next migration).
 */
import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('search_runs', (t) => {
    t.increments('id').primary();
    t.integer('pulsar_id').unsigned().notNullable().references('pulsars.id').onDelete('CASCADE');
    t.integer('revision_id').unsigned().notNullable().references('model_revisions.id').onDelete('CASCADE');
    t.specificType('inputs_hash', 'CHAR(64)').notNullable(); // SHA-256 hex
    t.json('options').notNullable(); // SearchOptions (api/contracts/search-runs.ts), defaults filled in
    t.json('settings').notNullable(); // SEARCH_ENGINE_SETTINGS
    t.enum('status', ['queued', 'running', 'succeeded', 'failed', 'cancelled']).notNullable().defaultTo('queued');
    t.double('progress_percent').notNullable().defaultTo(0);
    t.string('stage', 120).notNullable().defaultTo('queued');
    t.string('job_id', 64).nullable();
    t.integer('requested_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.datetime('queued_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.datetime('started_at', { precision: 3 }).nullable();
    t.datetime('finished_at', { precision: 3 }).nullable();
    t.integer('duration_ms').unsigned().nullable();
    t.text('error_message').nullable();
    t.integer('toa_count').unsigned().nullable();
    t.integer('excluded_count').unsigned().nullable();
    t.specificType('result_json', 'LONGTEXT').nullable();
    t.integer('companions_found').unsigned().nullable();
    t.double('final_chi2').nullable();
    t.integer('saved_revision_id').unsigned().nullable().references('model_revisions.id').onDelete('SET NULL');
    t.index(['pulsar_id', 'id'], 'search_runs_pulsar_index');
    t.index(['inputs_hash', 'status'], 'search_runs_inputs_hash_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('search_runs');
}

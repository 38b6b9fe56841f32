/**
 * Fit runs: the inputs of one queued fit (model revision, TOA selection and
 * engine settings, summarised by `inputs_hash`), its progress and timings, and
 * its outputs (result_json plus the listing statistics). `campaign_id` has no
 * foreign key yet: the campaigns table arrives in a later migration, which adds it.
 */
import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('fit_runs', (t) => {
    t.increments('id').primary();
    t.integer('pulsar_id').unsigned().notNullable().references('pulsars.id').onDelete('CASCADE');
    t.integer('revision_id').unsigned().notNullable().references('model_revisions.id').onDelete('CASCADE');
    t.integer('campaign_id').unsigned().nullable();
    t.specificType('inputs_hash', 'CHAR(64)').notNullable(); // SHA-256 hex
    t.json('settings').notNullable();
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
    t.double('chi2').nullable();
    t.double('reduced_chi2').nullable();
    t.double('weighted_rms_us').nullable();
    t.index(['pulsar_id', 'id'], 'fit_runs_pulsar_index');
    t.index(['inputs_hash', 'status'], 'fit_runs_inputs_hash_index');
    t.index(['campaign_id'], 'fit_runs_campaign_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('fit_runs');
}

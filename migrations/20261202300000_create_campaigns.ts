/**
 * Campaigns (batch reprocessing): which pulsars ('all' or a list of ids), which
 * revision of each to fit ('latest' or 'released'), progress, and the summary
 * of what changed (reduced χ² and weighted RMS before/after per pulsar).
 */
import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('campaigns', (t) => {
    t.increments('id').primary();
    t.string('name', 120).notNullable();
    t.integer('created_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.enu('revision_choice', ['latest', 'released']).notNullable();
    t.json('pulsar_selection').notNullable(); // "all" or an array of pulsar ids
    t.boolean('notify_creator').notNullable().defaultTo(false);
    t.boolean('recompute').notNullable().defaultTo(false); // true: refit even when a succeeded run has the same inputs
    t.enu('status', ['queued', 'running', 'succeeded', 'failed', 'cancelled']).notNullable().defaultTo('queued');
    t.integer('progress_done').unsigned().notNullable().defaultTo(0);
    t.integer('progress_total').unsigned().notNullable().defaultTo(0);
    t.string('progress_stage', 120).notNullable().defaultTo('queued');
    t.string('job_id', 64).nullable(); // BullMQ job id of the `campaign` job
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.datetime('started_at', { precision: 3 }).nullable();
    t.datetime('finished_at', { precision: 3 }).nullable();
    t.json('summary_json').nullable();
    t.string('error_message', 2000).nullable();
    t.index(['created_at'], 'campaigns_created_at_idx');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('campaigns');
}

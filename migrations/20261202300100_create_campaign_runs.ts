/**
 * One row per pulsar of a campaign: the revision chosen for it, the fit run it
 * spawned (or why it was skipped), and the "before" figures, taken from the
 * pulsar's last succeeded fit when the campaign fanned out.
 */
import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('campaign_runs', (t) => {
    t.increments('id').primary();
    t.integer('campaign_id').unsigned().notNullable().references('campaigns.id').onDelete('CASCADE');
    t.integer('pulsar_id').unsigned().notNullable().references('pulsars.id').onDelete('CASCADE');
    t.integer('revision_id').unsigned().nullable(); // model_revisions.id (no FK: that table belongs to another migration set)
    t.integer('fit_run_id').unsigned().nullable(); // fit_runs.id, set once the fit run is created
    t.enu('status', ['pending', 'queued', 'running', 'succeeded', 'failed', 'cancelled', 'skipped']).notNullable().defaultTo('pending');
    t.string('skipped_reason', 200).nullable(); // e.g. 'no released revision', 'no TOAs'
    t.integer('before_fit_run_id').unsigned().nullable();
    t.double('before_reduced_chi2').nullable();
    t.double('before_weighted_rms_us').nullable();
    t.unique(['campaign_id', 'pulsar_id'], { indexName: 'campaign_runs_campaign_pulsar_uq' });
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('campaign_runs');
}

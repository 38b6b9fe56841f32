/**
 * fit_runs.campaign_id → campaigns.id (ON DELETE SET NULL): a fit run remembers
 * the campaign that spawned it. fit_runs comes from 20261202200100; the guard
 * keeps this migration harmless on a schema where that column does not exist.
 */
import type { Knex } from 'knex';

const FK_NAME = 'fit_runs_campaign_id_fk';

export async function up(knex: Knex): Promise<void> {
  if (!(await knex.schema.hasTable('fit_runs')) || !(await knex.schema.hasColumn('fit_runs', 'campaign_id'))) return;
  await knex.schema.alterTable('fit_runs', (t) => {
    t.foreign('campaign_id', FK_NAME).references('campaigns.id').onDelete('SET NULL');
  });
}

export async function down(knex: Knex): Promise<void> {
  if (!(await knex.schema.hasTable('fit_runs'))) return;
  const [rows] = await knex.raw(
    'SELECT 1 FROM information_schema.TABLE_CONSTRAINTS WHERE CONSTRAINT_SCHEMA = DATABASE() AND TABLE_NAME = ? AND CONSTRAINT_NAME = ?',
    ['fit_runs', FK_NAME],
  );
  if ((rows as unknown[]).length === 0) return;
  await knex.schema.alterTable('fit_runs', (t) => {
    t.dropForeign(['campaign_id'], FK_NAME);
  });
}

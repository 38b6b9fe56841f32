/** Every campaign, newest first, with its runs (docs/api-workflow.md Campaign[]). */
import type { Knex } from 'knex';
import { presentCampaign, type Campaign, type CampaignRow, type CampaignRunRow } from '../../db/campaigns';

export async function listCampaigns(knex: Knex): Promise<Campaign[]> {
  const rows: (CampaignRow & { creator_name: string | null })[] = await knex('campaigns as c')
    .leftJoin('users as u', 'u.id', 'c.created_by')
    .orderBy([{ column: 'c.created_at', order: 'desc' }, { column: 'c.id', order: 'desc' }])
    .select('c.*', 'u.display_name as creator_name');
  if (rows.length === 0) return [];
  const runs: (CampaignRunRow & { pulsar_name: string })[] = await knex('campaign_runs as r')
    .join('pulsars as p', 'p.id', 'r.pulsar_id')
    .whereIn('r.campaign_id', rows.map((r) => r.id))
    .orderBy('p.name')
    .select('r.*', 'p.name as pulsar_name');
  const byCampaign = new Map<number, typeof runs>();
  for (const run of runs) byCampaign.set(run.campaign_id, [...(byCampaign.get(run.campaign_id) ?? []), run]);
  return rows.map((row) => presentCampaign(row, byCampaign.get(row.id) ?? []));
}

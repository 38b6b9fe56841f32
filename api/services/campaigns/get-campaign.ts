/** One campaign with its runs and summary, or 404. */
import type { Knex } from 'knex';
import { findCampaign, loadCampaignRuns, presentCampaign, type Campaign } from '../../db/campaigns';
import { notFound } from '../../errors';

export async function getCampaign(knex: Knex, id: number): Promise<Campaign> {
  const row = await findCampaign(knex, id);
  if (!row) throw notFound('campaign');
  return presentCampaign(row, await loadCampaignRuns(knex, id));
}

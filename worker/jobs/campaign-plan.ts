/**
 * Step 1 of a campaign: decide, once, what happens to each pulsar. Resolves
 * the selection ('all' = every pulsar at that moment; listed pulsars deleted
 * since are left out), picks each pulsar's revision (latest = newest revision;
 * released = newest revision with released_at set), skips a pulsar without
 * one or without TOAs, and records the "before" figures (the pulsar's last
 * succeeded fit finished before the campaign was created). All rows go in
 * one transaction, so a crash leaves either the whole plan or none.
 */
import type { Knex } from 'knex';
import { pulsarSelectionOf, type CampaignRow, type CampaignRunRow } from '../../api/db/campaigns';
import { findPreviousFit } from '../../api/services/campaigns/find-previous-fit';

/** Inserts the campaign_runs rows unless they exist; returns how many the campaign has. */
export async function planCampaignRuns(knex: Knex, campaign: CampaignRow): Promise<number> {
  const existing = await countRuns(knex, campaign.id);
  if (existing > 0) return existing;
  const selection = pulsarSelectionOf(campaign);
  const pulsarIds: number[] = (
    await (selection === 'all' ? knex('pulsars') : knex('pulsars').whereIn('id', selection)).orderBy('name').pluck('id')
  ).map(Number);
  const toaCounts = await countToas(knex, pulsarIds);
  const rows: Omit<CampaignRunRow, 'id' | 'fit_run_id'>[] = [];
  for (const pulsarId of pulsarIds) {
    const revisionId = await chooseRevision(knex, pulsarId, campaign.revision_choice);
    const skippedReason =
      revisionId === null ? (campaign.revision_choice === 'released' ? 'no released revision' : 'no revision')
        : (toaCounts.get(pulsarId) ?? 0) === 0 ? 'no TOAs' : null;
    const before = await findPreviousFit(knex, pulsarId, { finishedBefore: campaign.created_at });
    rows.push({
      campaign_id: campaign.id,
      pulsar_id: pulsarId,
      revision_id: revisionId,
      status: skippedReason ? 'skipped' : 'pending',
      skipped_reason: skippedReason,
      before_fit_run_id: before?.fitRunId ?? null,
      before_reduced_chi2: before?.reducedChi2 ?? null,
      before_weighted_rms_us: before?.weightedRmsUs ?? null,
    });
  }
  // The campaign row first, then its runs: the same lock order as cancelCampaign, so the two cannot deadlock.
  await knex.transaction(async (trx) => {
    await trx('campaigns').where({ id: campaign.id }).update({ progress_total: rows.length, progress_stage: 'fanning out' });
    if (rows.length > 0) await trx('campaign_runs').insert(rows).onConflict(['campaign_id', 'pulsar_id']).ignore();
  });
  return rows.length;
}

async function countRuns(knex: Knex, campaignId: number): Promise<number> {
  const [{ n }] = await knex('campaign_runs').where({ campaign_id: campaignId }).count({ n: '*' });
  return Number(n);
}

/** The revision a campaign fits for one pulsar, or null when the pulsar has none of that kind. */
export async function chooseRevision(knex: Knex, pulsarId: number, choice: 'latest' | 'released'): Promise<number | null> {
  const q = knex('model_revisions').where({ pulsar_id: pulsarId });
  if (choice === 'released') q.whereNotNull('released_at');
  const row = await q.orderBy([{ column: 'created_at', order: 'desc' }, { column: 'id', order: 'desc' }]).first('id');
  return row ? Number(row.id) : null;
}

async function countToas(knex: Knex, pulsarIds: number[]): Promise<Map<number, number>> {
  if (pulsarIds.length === 0 || !(await knex.schema.hasTable('toas'))) return new Map();
  const rows: { pulsar_id: number; n: number | string }[] = await knex('toas').whereIn('pulsar_id', pulsarIds).groupBy('pulsar_id').select('pulsar_id').count({ n: '*' });
  return new Map(rows.map((r) => [Number(r.pulsar_id), Number(r.n)]));
}

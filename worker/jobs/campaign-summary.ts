/**
 * What a campaign changed, per pulsar: reduced χ² and weighted RMS before (the
 * figures recorded at planning time) and after (its fit run's outputs, when
 * that run succeeded), with the run's status. Also keeps campaign_runs.status
 * in step with the fit runs they point at.
 */
import type { Knex } from 'knex';
import { FINAL_RUN_STATUSES, loadCampaignRuns, type CampaignRunStatus, type CampaignSummaryItem } from '../../api/db/campaigns';
import { nullableNumber } from '../../api/services/campaigns/find-previous-fit';

export interface CampaignState {
  summary: CampaignSummaryItem[];
  done: number;
  total: number;
  /** Runs whose fit failed, with the engine's message. */
  failures: { pulsarName: string; message: string }[];
}

/** Copies each fit run's status onto its campaign_runs row and returns the current per-pulsar state. */
export async function syncCampaignState(knex: Knex, campaignId: number): Promise<CampaignState> {
  const runs = await loadCampaignRuns(knex, campaignId);
  const fitIds = runs.map((r) => r.fit_run_id).filter((id): id is number => id !== null);
  const fits = new Map<number, { status: CampaignRunStatus; reduced_chi2: unknown; weighted_rms_us: unknown; error_message: string | null }>();
  if (fitIds.length > 0) {
    const rows = await knex('fit_runs').whereIn('id', fitIds).select('id', 'status', 'reduced_chi2', 'weighted_rms_us', 'error_message');
    for (const row of rows) fits.set(Number(row.id), row);
  }
  const summary: CampaignSummaryItem[] = [];
  const failures: CampaignState['failures'] = [];
  for (const run of runs) {
    const fit = run.fit_run_id !== null ? fits.get(run.fit_run_id) : undefined;
    let status = run.status;
    if (fit && fit.status !== run.status && run.status !== 'cancelled') {
      status = fit.status;
      await knex('campaign_runs').where({ id: run.id }).update({ status });
    }
    if (fit && fit.status === 'failed') failures.push({ pulsarName: run.pulsar_name, message: fit.error_message ?? 'no message' });
    const hasBefore = run.before_fit_run_id !== null;
    summary.push({
      pulsarId: run.pulsar_id,
      pulsarName: run.pulsar_name,
      fitRunId: run.fit_run_id,
      before: hasBefore ? { reducedChi2: nullableNumber(run.before_reduced_chi2), weightedRmsUs: nullableNumber(run.before_weighted_rms_us) } : null,
      after: fit && fit.status === 'succeeded' ? { reducedChi2: nullableNumber(fit.reduced_chi2), weightedRmsUs: nullableNumber(fit.weighted_rms_us) } : null,
      status,
      skippedReason: run.skipped_reason,
    });
  }
  const done = summary.filter((s) => FINAL_RUN_STATUSES.includes(s.status)).length;
  return { summary, done, total: runs.length, failures };
}

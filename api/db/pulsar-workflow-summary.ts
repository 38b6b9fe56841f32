/**
 * What the pulsar list shows beside the TOA statistics: the newest fit run
 * (any status) and how many model revisions exist.
 */
import type { Knex } from 'knex';

export interface LatestFit {
  id: number;
  status: string;
  reducedChi2: number | null;
  weightedRmsUs: number | null;
  finishedAt: string | null;
}

export interface PulsarWorkflowSummary {
  latestFit: LatestFit | null;
  revisionCount: number;
}

export async function loadWorkflowSummaries(knex: Knex, pulsarIds: number[]): Promise<Map<number, PulsarWorkflowSummary>> {
  const summaries = new Map<number, PulsarWorkflowSummary>(pulsarIds.map((id) => [id, { latestFit: null, revisionCount: 0 }]));
  if (pulsarIds.length === 0) return summaries;
  const newestRunIds = knex('fit_runs').whereIn('pulsar_id', pulsarIds).groupBy('pulsar_id').max({ id: 'id' });
  const runs = await knex('fit_runs')
    .whereIn('id', knex.select('id').from(newestRunIds.as('newest')))
    .select('id', 'pulsar_id', 'status', 'reduced_chi2', 'weighted_rms_us', 'finished_at');
  for (const run of runs) {
    summaries.get(Number(run.pulsar_id))!.latestFit = {
      id: Number(run.id),
      status: run.status,
      reducedChi2: run.reduced_chi2 === null ? null : Number(run.reduced_chi2),
      weightedRmsUs: run.weighted_rms_us === null ? null : Number(run.weighted_rms_us),
      finishedAt: run.finished_at ? new Date(run.finished_at).toISOString() : null,
    };
  }
  const counts: { pulsar_id: number; n: number | string }[] = await knex('model_revisions')
    .whereIn('pulsar_id', pulsarIds).groupBy('pulsar_id').select('pulsar_id').count({ n: '*' });
  for (const row of counts) summaries.get(Number(row.pulsar_id))!.revisionCount = Number(row.n);
  return summaries;
}

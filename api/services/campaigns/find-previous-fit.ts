/**
 * The "before" of a comparison: a pulsar's newest succeeded fit run that
 * finished before a moment (a campaign's start) or before a given run.
 */
import type { Knex } from 'knex';
import type { FitFigures } from '../../db/campaigns';

export interface PreviousFit extends FitFigures {
  fitRunId: number;
}

export async function findPreviousFit(
  knex: Knex,
  pulsarId: number,
  limit: { finishedBefore: Date; excludeFitRunId?: number },
): Promise<PreviousFit | null> {
  const q = knex('fit_runs')
    .where({ pulsar_id: pulsarId, status: 'succeeded' })
    .whereNotNull('finished_at')
    .where('finished_at', '<', limit.finishedBefore);
  if (limit.excludeFitRunId !== undefined) q.whereNot('id', limit.excludeFitRunId);
  const row = await q.orderBy([{ column: 'finished_at', order: 'desc' }, { column: 'id', order: 'desc' }]).first('id', 'reduced_chi2', 'weighted_rms_us');
  if (!row) return null;
  return { fitRunId: row.id, reducedChi2: nullableNumber(row.reduced_chi2), weightedRmsUs: nullableNumber(row.weighted_rms_us) };
}

export function nullableNumber(value: unknown): number | null {
  return value === null || value === undefined ? null : Number(value);
}

/**
 * Recounts a pulsar's stored arrival times into its statistics columns
 * (toa_count, first_mjd, last_mjd, observatories: the columns the
 * toa-statistics job also writes), inside the caller's transaction.
 */
import type { Knex } from 'knex';
import { mjdTextFromStored } from '../../db/toas';

export interface ToaStatistics {
  toaCount: number;
  firstMjd: string | null;
  lastMjd: string | null;
  observatories: string[];
}

export async function recomputeToaStatistics(trx: Knex | Knex.Transaction, pulsarId: number): Promise<ToaStatistics> {
  const rows = trx('toas').where({ pulsar_id: pulsarId });
  const [{ n }] = await rows.clone().count({ n: '*' });
  const toaCount = Number(n);
  let stats: ToaStatistics = { toaCount, firstMjd: null, lastMjd: null, observatories: [] };
  if (toaCount > 0) {
    const first = await rows.clone().orderBy([{ column: 'mjd_day' }, { column: 'mjd_fraction' }]).first('mjd_day', 'mjd_fraction');
    const last = await rows.clone().orderBy([{ column: 'mjd_day', order: 'desc' }, { column: 'mjd_fraction', order: 'desc' }]).first('mjd_day', 'mjd_fraction');
    const observatories = (await rows.clone().distinct('observatory').orderBy('observatory')).map((r) => r.observatory as string);
    stats = {
      toaCount,
      firstMjd: mjdTextFromStored(first.mjd_day, first.mjd_fraction),
      lastMjd: mjdTextFromStored(last.mjd_day, last.mjd_fraction),
      observatories,
    };
  }
  await trx('pulsars').where({ id: pulsarId }).update({
    toa_count: stats.toaCount,
    first_mjd: stats.firstMjd,
    last_mjd: stats.lastMjd,
    observatories: JSON.stringify(stats.observatories),
    statistics_updated_at: trx.fn.now(3),
  });
  return stats;
}

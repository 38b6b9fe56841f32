/**
 * BullMQ processor `toa-statistics`: recounts one pulsar's arrival times (count,
 * first and last MJD, observatories, backends) and stores them on the pulsar,
 * where the dashboard reads them. Until TOA storage exists the count is 0.
 */
import { UnrecoverableError, type Job } from 'bullmq';
import type { Knex } from 'knex';
import {
  ToaStatisticsJob,
  type JobProgress,
  type ToaStatisticsResult,
} from '../../api/contracts/queues';

interface Deps { knex: Knex }

async function report(job: Job, percent: number, stage: string): Promise<void> {
  const progress: JobProgress = { percent, stage };
  await job.updateProgress(progress);
}

export async function processToaStatistics(job: Job, { knex }: Deps): Promise<ToaStatisticsResult> {
  const parsed = ToaStatisticsJob.safeParse(job.data);
  if (!parsed.success) throw new UnrecoverableError(`toa-statistics: bad payload: ${parsed.error.issues[0]?.message}`);
  const { pulsarId } = parsed.data;

  await report(job, 10, 'reading pulsar');
  const pulsar = await knex('pulsars').where({ id: pulsarId }).first('id');
  if (!pulsar) throw new UnrecoverableError(`toa-statistics: pulsar ${pulsarId} does not exist`);

  await report(job, 40, 'counting arrival times');
  const stats = (await knex.schema.hasTable('toas'))
    ? await countToas(knex, pulsarId)
    : { toaCount: 0, firstMjd: null, lastMjd: null, observatories: [], backends: [] };

  await report(job, 80, 'storing statistics');
  await knex('pulsars').where({ id: pulsarId }).update({
    toa_count: stats.toaCount,
    first_mjd: stats.firstMjd,
    last_mjd: stats.lastMjd,
    observatories: JSON.stringify(stats.observatories),
    statistics_updated_at: knex.fn.now(),
  });
  await report(job, 100, 'done');
  return { pulsarId, ...stats };
}

/** Counts stored TOAs (table layout of the TOA-storage migrations: mjd_day + mjd_fraction). */
async function countToas(knex: Knex, pulsarId: number): Promise<Omit<ToaStatisticsResult, 'pulsarId'>> {
  const rows = knex('toas').where({ pulsar_id: pulsarId });
  const [{ n }] = await rows.clone().count({ n: '*' });
  const toaCount = Number(n);
  if (toaCount === 0) return { toaCount, firstMjd: null, lastMjd: null, observatories: [], backends: [] };
  const first = await rows.clone().orderBy([{ column: 'mjd_day' }, { column: 'mjd_fraction' }]).first('mjd_day', 'mjd_fraction');
  const last = await rows.clone().orderBy([{ column: 'mjd_day', order: 'desc' }, { column: 'mjd_fraction', order: 'desc' }]).first('mjd_day', 'mjd_fraction');
  const observatories = (await rows.clone().distinct('observatory').orderBy('observatory')).map((r) => r.observatory as string);
  const backends = (await rows.clone().distinct('backend').orderBy('backend')).map((r) => r.backend as string);
  return { toaCount, firstMjd: joinMjd(first), lastMjd: joinMjd(last), observatories, backends };
}

/** Day and DECIMAL fraction string ("0.25…") joined as a decimal MJD string, without floats. */
function joinMjd(row: { mjd_day: number | string; mjd_fraction: string }): string {
  const frac = String(row.mjd_fraction).replace(/^0(?=\.)/, '');
  return `${row.mjd_day}${frac.startsWith('.') ? frac : ''}`;
}

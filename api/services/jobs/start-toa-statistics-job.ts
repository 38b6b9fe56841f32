/** Queues the toa-statistics job of an existing pulsar; returns the BullMQ job id. */
import type { Queue } from 'bullmq';
import type { Knex } from 'knex';
import { JOB_TYPES, ToaStatisticsJob } from '../../contracts/queues';
import { notFound } from '../../errors';

export async function startToaStatisticsJob(knex: Knex, queue: Queue, pulsarId: number): Promise<{ jobId: string }> {
  if (!(await knex('pulsars').where({ id: pulsarId }).first('id'))) throw notFound('pulsar');
  const job = await queue.add(JOB_TYPES.toaStatistics, ToaStatisticsJob.parse({ pulsarId }));
  return { jobId: String(job.id) };
}

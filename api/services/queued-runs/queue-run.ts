/**
 * The steps createFitRun and createSearchRun share when they queue a run for
 * the worker: check the pulsar and its revision, offer an earlier succeeded run
 * with the same inputs hash, and hand the inserted run's job to BullMQ.
 */
import type { JobsOptions, Queue } from 'bullmq';
import type { Knex } from 'knex';
import type { QueuedRunRow, QueuedRunTable } from '../../db/queued-runs';
import { findRevision, type RevisionRow } from '../../db/revisions';
import { fieldError, notFound } from '../../errors';

/**
 * @returns the revision a run is asked for
 * Throws 404 for an unknown pulsar or revision; 400 (path revisionId) for a
 * revision of another pulsar.
 */
export async function loadRevisionOfPulsar(knex: Knex, pulsarId: number, revisionId: number): Promise<RevisionRow> {
  const pulsar = await knex('pulsars').where({ id: pulsarId }).first('id');
  if (!pulsar) throw notFound('pulsar');
  const revision = await findRevision(knex, revisionId);
  if (!revision) throw notFound('revision');
  if (revision.pulsar_id !== pulsarId) throw fieldError(['revisionId'], 'not a revision of this pulsar');
  return revision;
}

/** @returns the pulsar's latest succeeded run with this inputs hash, if any (offered instead of a new run) */
export async function findReusableRun<Row extends QueuedRunRow>(knex: Knex, table: QueuedRunTable, pulsarId: number, inputsHash: string): Promise<Row | undefined> {
  return (await knex(table).where({ inputs_hash: inputsHash, status: 'succeeded', pulsar_id: pulsarId }).orderBy('id', 'desc').first()) as Row | undefined;
}

export interface EnqueueRun {
  table: QueuedRunTable;
  id: number;
  /** one job per run (so queueing twice is a no-op) */
  jobId: string;
  jobType: string;
  payload: object;
  /** more BullMQ options (e.g. a parent job) */
  options?: Omit<JobsOptions, 'jobId'>;
  /** what is queued, for the error message ('fit' → "could not queue the fit: …") */
  what: string;
}

/**
 * Stores the job id on the run's row and adds the job to the queue. When
 * queueing fails the run is marked failed (stage 'not queued') and the error
 * is rethrown.
 */
export async function enqueueRun(knex: Knex, queue: Queue, run: EnqueueRun): Promise<void> {
  await knex(run.table).where({ id: run.id }).update({ job_id: run.jobId });
  try {
    await queue.add(run.jobType, run.payload, { jobId: run.jobId, ...run.options });
  } catch (error) {
    await knex(run.table)
      .where({ id: run.id })
      .update({ status: 'failed', stage: 'not queued', error_message: `could not queue the ${run.what}: ${(error as Error).message}`, finished_at: knex.fn.now(3) });
    throw error;
  }
}

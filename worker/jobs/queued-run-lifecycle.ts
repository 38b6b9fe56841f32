/**
 * The BullMQ job lifecycle shared by the `fit-run` and `search-run`
 * processors: claim the run's row, report progress (noticing a cancel), wait
 * for the engine thread, commit only while the run is still running, and mark
 * the run failed when the job will not be retried.
 *
 * Rules (both processors' notes):
 * 1. A run cancelled meanwhile stops with RunCancelledError (UnrecoverableError
 *    'cancelled') without touching the status or storing anything.
 * 2. A job re-run after a crash (stall detection) claims a 'running' row again;
 *    one that finds the run already succeeded returns at once.
 * 3. Engine input errors are not retried (UnrecoverableError); anything else
 *    is thrown for BullMQ to retry, and the last attempt marks the run failed.
 */
import { UnrecoverableError, type Job } from 'bullmq';
import type { Knex } from 'knex';
import type { JobProgress } from '../../api/contracts/queues';
import { reportRunProgress, type QueuedRunTable } from '../../api/db/queued-runs';
import { EngineThreadError, type RunningEngineThread } from './engine-thread';

/** The run was cancelled (or reached a final status) while the job ran: stop, store nothing. */
export class RunCancelledError extends UnrecoverableError {
  constructor() {
    super('cancelled');
  }
}

/** Where a run lives and what to call it in messages ('fit' → "fit-run: fit run 7 …"). */
export interface QueuedRunRef {
  table: QueuedRunTable;
  label: string;
  id: number;
}

/**
 * Checks the row a job found before it starts work.
 *
 * @returns true when the run has already succeeded (an earlier attempt committed: return at once)
 * Throws UnrecoverableError when the row does not exist or the run has failed;
 * RunCancelledError when it was cancelled.
 */
export function alreadySucceeded(ref: QueuedRunRef, run: { status: string; error_message: string | null } | undefined): boolean {
  if (!run) throw new UnrecoverableError(`${ref.label}-run: ${ref.label} run ${ref.id} does not exist`);
  if (run.status === 'succeeded') return true;
  if (run.status === 'cancelled') throw new RunCancelledError();
  if (run.status === 'failed') throw new UnrecoverableError(`${ref.label}-run: ${ref.label} run ${ref.id} has already failed: ${run.error_message ?? ''}`);
  return false;
}

/**
 * Runs the job's work; when it throws something BullMQ will not retry (an
 * UnrecoverableError other than a cancel, or the job's last attempt), marks
 * the run failed with the error's message first, then rethrows.
 *
 * @param onFailed  called once the run was marked failed here (e.g. to notify)
 */
export async function failRunWhenFinal<T>(job: Job, knex: Knex, ref: QueuedRunRef, work: () => Promise<T>, onFailed?: () => Promise<void>): Promise<T> {
  try {
    return await work();
  } catch (error) {
    if (error instanceof RunCancelledError) throw error;
    const unrecoverable = error instanceof UnrecoverableError;
    const lastAttempt = job.attemptsMade + 1 >= (job.opts.attempts ?? 1);
    if (unrecoverable || lastAttempt) {
      const failed = await markRunFailed(knex, ref, (error as Error).message).catch(() => false);
      if (failed && onFailed) await onFailed();
    }
    throw error;
  }
}

/**
 * Claims a queued (or, after a crash, still running) run: status 'running',
 * stage 'loading TOAs', and reports that stage.
 *
 * @returns the start time (ms since the epoch) and the progress reporter:
 *          `report(percent, stage)` updates the job and the row, and throws
 *          RunCancelledError once the row is no longer 'running'
 * Throws RunCancelledError when the run has left queued/running meanwhile.
 */
export async function claimRun(
  job: Job,
  knex: Knex,
  ref: QueuedRunRef,
): Promise<{ startedAtMs: number; report: (percent: number, stage: string) => Promise<void> }> {
  const startedAtMs = Date.now();
  const started = await knex(ref.table)
    .where({ id: ref.id })
    .whereIn('status', ['queued', 'running'])
    .update({ status: 'running', started_at: new Date(startedAtMs), progress_percent: 0, stage: 'loading TOAs', error_message: null });
  if (started === 0) throw new RunCancelledError();
  const report = async (percent: number, stage: string) => {
    const progress: JobProgress = { percent, stage };
    await job.updateProgress(progress);
    const status = await reportRunProgress(knex, ref.table, ref.id, percent, stage);
    if (status !== 'running') throw new RunCancelledError();
  };
  await report(0, 'loading TOAs');
  return { startedAtMs, report };
}

/**
 * Waits for the engine thread; on any failure terminates it.
 *
 * @returns the engine output
 * Throws UnrecoverableError (no retry) for the engine's input errors, else the thread's error.
 */
export async function engineResult<Output>(thread: RunningEngineThread<Output>): Promise<Output> {
  try {
    return await thread.result;
  } catch (error) {
    await thread.terminate();
    if (error instanceof EngineThreadError && error.timingInput) throw new UnrecoverableError(error.message);
    throw error;
  }
}

/**
 * Inside the commit transaction: locks the run's row and throws
 * RunCancelledError unless it is still 'running' (so outputs are stored once).
 */
export async function lockRunningRow(trx: Knex.Transaction, ref: QueuedRunRef): Promise<void> {
  const current = (await trx(ref.table).where({ id: ref.id }).forUpdate().first('status')) as { status: string } | undefined;
  if (current?.status !== 'running') throw new RunCancelledError();
}

/** Marks a queued or running run failed; false when it had already reached a final status. */
export async function markRunFailed(knex: Knex, ref: QueuedRunRef, message: string): Promise<boolean> {
  const changed = await knex(ref.table)
    .where({ id: ref.id })
    .whereIn('status', ['queued', 'running'])
    .update({ status: 'failed', stage: 'failed', error_message: message, finished_at: knex.fn.now(3) });
  return changed > 0;
}

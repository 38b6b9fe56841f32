/**
 * What `fit_runs` and `search_runs` share: a run queued for the worker, with
 * its status, progress, timings and requester. The row columns common to both
 * tables, their presentation (the common part of FitRun and SearchRun of
 * api/contracts) and the progress update the worker makes.
 */
import type { Knex } from 'knex';
import type { UserRef } from '../contracts/fit-runs';

/** The tables of queued runs. */
export type QueuedRunTable = 'fit_runs' | 'search_runs';

/** Columns every queued-run table has; `Status` is the table's status union. */
export interface QueuedRunRow<Status extends string = string> {
  id: number;
  pulsar_id: number;
  revision_id: number;
  inputs_hash: string;
  status: Status;
  progress_percent: number;
  stage: string;
  job_id: string | null;
  requested_by: number | null;
  queued_at: Date;
  started_at: Date | null;
  finished_at: Date | null;
  duration_ms: number | null;
  error_message: string | null;
  toa_count: number | null;
  excluded_count: number | null;
  result_json: string | null;
}

/** The presented fields every queued run has (the rest is the table's own). */
export interface QueuedRunFields<Status extends string> {
  id: number;
  pulsarId: number;
  revisionId: number;
  status: Status;
  progress: { percent: number; stage: string };
  inputsHash: string;
  toaCount: number | null;
  excludedCount: number | null;
  requestedBy: UserRef | null;
  queuedAt: string;
  startedAt: string | null;
  finishedAt: string | null;
  durationMs: number | null;
  errorMessage: string | null;
}

const iso = (d: Date | null): string | null => (d ? d.toISOString() : null);

/**
 * @param users  requesters by id (userRefs of api/db/revisions.ts); an unknown id presents as null
 * @returns the common fields of the run's presentation
 */
export function presentQueuedRunFields<Status extends string>(row: QueuedRunRow<Status>, users: Map<number, UserRef>): QueuedRunFields<Status> {
  return {
    id: row.id,
    pulsarId: row.pulsar_id,
    revisionId: row.revision_id,
    status: row.status,
    progress: { percent: row.progress_percent, stage: row.stage },
    inputsHash: row.inputs_hash,
    toaCount: row.toa_count,
    excludedCount: row.excluded_count,
    requestedBy: row.requested_by === null ? null : (users.get(row.requested_by) ?? null),
    queuedAt: row.queued_at.toISOString(),
    startedAt: iso(row.started_at),
    finishedAt: iso(row.finished_at),
    durationMs: row.duration_ms,
    errorMessage: row.error_message,
  };
}

/**
 * Sets progress on a run that is still running.
 *
 * @returns the run's status afterwards (to notice a cancel); undefined when the run is gone
 */
export async function reportRunProgress(knex: Knex, table: QueuedRunTable, id: number, percent: number, stage: string): Promise<string | undefined> {
  await knex(table).where({ id, status: 'running' }).update({ progress_percent: percent, stage });
  const row = (await knex(table).where({ id }).first('status')) as { status: string } | undefined;
  return row?.status;
}

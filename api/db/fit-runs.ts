/**
 * Row type of `fit_runs`, its presentations (FitRun, FitRunSummary of
 * api/contracts/fit-runs.ts) and the small updates the worker makes.
 */
import type { Knex } from 'knex';
import type { FitEngineSettings, FitResult, FitRun, FitRunStatus, FitRunSummary, UserRef } from '../contracts/fit-runs';
import { userRefs } from './revisions';

export interface FitRunRow {
  id: number;
  pulsar_id: number;
  revision_id: number;
  campaign_id: number | null;
  inputs_hash: string;
  settings: string | FitEngineSettings; // JSON column: text from MariaDB
  status: FitRunStatus;
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
  chi2: number | null;
  reduced_chi2: number | null;
  weighted_rms_us: number | null;
}

const iso = (d: Date | null): string | null => (d ? d.toISOString() : null);

export function presentFitRun(row: FitRunRow, users: Map<number, UserRef>): FitRun {
  return {
    id: row.id,
    pulsarId: row.pulsar_id,
    revisionId: row.revision_id,
    campaignId: row.campaign_id,
    status: row.status,
    progress: { percent: row.progress_percent, stage: row.stage },
    inputsHash: row.inputs_hash,
    settings: (typeof row.settings === 'string' ? JSON.parse(row.settings) : row.settings) as FitEngineSettings,
    toaCount: row.toa_count,
    excludedCount: row.excluded_count,
    requestedBy: row.requested_by === null ? null : (users.get(row.requested_by) ?? null),
    queuedAt: row.queued_at.toISOString(),
    startedAt: iso(row.started_at),
    finishedAt: iso(row.finished_at),
    durationMs: row.duration_ms,
    errorMessage: row.error_message,
    result: row.result_json === null ? null : (JSON.parse(row.result_json) as FitResult),
  };
}

export function summariseFitRun(run: FitRun): FitRunSummary {
  if (run.result === null) return { ...run, result: null };
  const { parameters: _parameters, fittedModel: _fittedModel, ...rest } = run.result;
  return { ...run, result: rest };
}

export async function presentFitRuns(knex: Knex, rows: readonly FitRunRow[]): Promise<FitRun[]> {
  const users = await userRefs(knex, rows.map((r) => r.requested_by));
  return rows.map((r) => presentFitRun(r, users));
}

export async function findFitRun(knex: Knex, id: number): Promise<FitRunRow | undefined> {
  return (await knex<FitRunRow>('fit_runs').where({ id }).first()) as FitRunRow | undefined;
}

/** Sets progress on a run that is still running; returns the run's status afterwards (to notice a cancel). */
export async function reportFitRunProgress(knex: Knex, id: number, percent: number, stage: string): Promise<FitRunStatus | undefined> {
  await knex('fit_runs').where({ id, status: 'running' }).update({ progress_percent: percent, stage });
  const row = (await knex('fit_runs').where({ id }).first('status')) as { status: FitRunStatus } | undefined;
  return row?.status;
}

/**
 * Row type of `fit_runs`, its presentations (FitRun, FitRunSummary of
 * api/contracts/fit-runs.ts); the worker's progress update is api/db/queued-runs.ts.
 */
import type { Knex } from 'knex';
import type { FitEngineSettings, FitResult, FitRun, FitRunStatus, FitRunSummary, UserRef } from '../contracts/fit-runs';
import { presentQueuedRunFields, type QueuedRunRow } from './queued-runs';
import { userRefs } from './revisions';

export interface FitRunRow extends QueuedRunRow<FitRunStatus> {
  campaign_id: number | null;
  settings: string | FitEngineSettings; // JSON column: text from MariaDB
  chi2: number | null;
  reduced_chi2: number | null;
  weighted_rms_us: number | null;
}

export function presentFitRun(row: FitRunRow, users: Map<number, UserRef>): FitRun {
  return {
    ...presentQueuedRunFields(row, users),
    campaignId: row.campaign_id,
    settings: (typeof row.settings === 'string' ? JSON.parse(row.settings) : row.settings) as FitEngineSettings,
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

/**
 * Row types of `campaigns` and `campaign_runs`, the summary they carry, and the
 * JSON presentation of docs/api-workflow.md (Campaign). Shared by the API
 * services and the worker's `campaign` job.
 */
import type { Knex } from 'knex';

export type CampaignStatus = 'queued' | 'running' | 'succeeded' | 'failed' | 'cancelled';
export type CampaignRunStatus = 'pending' | 'queued' | 'running' | 'succeeded' | 'failed' | 'cancelled' | 'skipped';
export const FINAL_CAMPAIGN_STATUSES: readonly CampaignStatus[] = ['succeeded', 'failed', 'cancelled'];
/** Run states after which nothing more happens to that pulsar in this campaign. */
export const FINAL_RUN_STATUSES: readonly CampaignRunStatus[] = ['succeeded', 'failed', 'cancelled', 'skipped'];

export interface CampaignRow {
  id: number;
  name: string;
  created_by: number | null;
  revision_choice: 'latest' | 'released';
  pulsar_selection: string | 'all' | number[]; // JSON column: text from MariaDB
  notify_creator: number | boolean;
  recompute: number | boolean;
  status: CampaignStatus;
  progress_done: number;
  progress_total: number;
  progress_stage: string;
  job_id: string | null;
  created_at: Date;
  started_at: Date | null;
  finished_at: Date | null;
  summary_json: string | CampaignSummaryItem[] | null;
  error_message: string | null;
}

export interface CampaignRunRow {
  id: number;
  campaign_id: number;
  pulsar_id: number;
  revision_id: number | null;
  fit_run_id: number | null;
  status: CampaignRunStatus;
  skipped_reason: string | null;
  before_fit_run_id: number | null;
  before_reduced_chi2: number | null;
  before_weighted_rms_us: number | null;
}

export interface FitFigures {
  reducedChi2: number | null;
  weightedRmsUs: number | null;
}

export interface CampaignSummaryItem {
  pulsarId: number;
  pulsarName: string;
  fitRunId: number | null;
  before: FitFigures | null;
  after: FitFigures | null;
  status: CampaignRunStatus;
  skippedReason: string | null;
}

export interface CampaignRun {
  pulsarId: number;
  pulsarName: string;
  revisionId: number | null;
  fitRunId: number | null;
  status: CampaignRunStatus;
  skippedReason: string | null;
}

export interface Campaign {
  id: number;
  name: string;
  createdBy: { id: number; displayName: string } | null;
  revisionChoice: 'latest' | 'released';
  recompute: boolean;
  pulsarSelection: 'all' | number[];
  status: CampaignStatus;
  progress: { percent: number; stage: string; done: number; total: number };
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
  errorMessage: string | null;
  runs: CampaignRun[];
  summary: CampaignSummaryItem[] | null;
}

/** A JSON column's value: mysql2 hands some back parsed (a top-level JSON string arrives as that string), others as text. */
function parseJson<T>(value: string | T | null): T | null {
  if (value === null || typeof value !== 'string') return value;
  try {
    return JSON.parse(value) as T;
  } catch {
    return value as T;
  }
}

export function pulsarSelectionOf(row: Pick<CampaignRow, 'pulsar_selection'>): 'all' | number[] {
  const parsed = parseJson<'all' | number[]>(row.pulsar_selection);
  return parsed === 'all' ? 'all' : (parsed ?? []).map(Number);
}

export function summaryOf(row: Pick<CampaignRow, 'summary_json'>): CampaignSummaryItem[] | null {
  return parseJson<CampaignSummaryItem[]>(row.summary_json);
}

/** The campaign's runs with pulsar names, in pulsar-name order. */
export async function loadCampaignRuns(knex: Knex, campaignId: number): Promise<(CampaignRunRow & { pulsar_name: string })[]> {
  return knex('campaign_runs as r')
    .join('pulsars as p', 'p.id', 'r.pulsar_id')
    .where('r.campaign_id', campaignId)
    .orderBy('p.name')
    .select('r.*', 'p.name as pulsar_name');
}

function percentOf(done: number, total: number, status: CampaignStatus): number {
  if (total === 0) return status === 'succeeded' ? 100 : 0;
  return Math.round((100 * done) / total);
}

export function presentCampaign(
  row: CampaignRow & { creator_name?: string | null },
  runs: (CampaignRunRow & { pulsar_name: string })[],
): Campaign {
  return {
    id: row.id,
    name: row.name,
    createdBy: row.created_by === null ? null : { id: row.created_by, displayName: row.creator_name ?? '' },
    revisionChoice: row.revision_choice,
    recompute: Boolean(row.recompute),
    pulsarSelection: pulsarSelectionOf(row),
    status: row.status,
    progress: {
      percent: percentOf(row.progress_done, row.progress_total, row.status),
      stage: row.progress_stage,
      done: row.progress_done,
      total: row.progress_total,
    },
    createdAt: row.created_at.toISOString(),
    startedAt: row.started_at ? row.started_at.toISOString() : null,
    finishedAt: row.finished_at ? row.finished_at.toISOString() : null,
    errorMessage: row.error_message,
    runs: runs.map((r) => ({
      pulsarId: r.pulsar_id,
      pulsarName: r.pulsar_name,
      revisionId: r.revision_id,
      fitRunId: r.fit_run_id,
      status: r.status,
      skippedReason: r.skipped_reason,
    })),
    summary: summaryOf(row),
  };
}

/** A campaign row with its creator's display name, or undefined. */
export async function findCampaign(knex: Knex, id: number): Promise<(CampaignRow & { creator_name: string | null }) | undefined> {
  return knex('campaigns as c').leftJoin('users as u', 'u.id', 'c.created_by').where('c.id', id).first('c.*', 'u.display_name as creator_name');
}

/**
 * Row types of `search_runs` and `search_periodograms`, their presentations
 * (SearchRun, SearchRunSummary, SearchPeriodograms of api/contracts/search-runs.ts)
 * and the periodogram encoding the worker uses.
 */
import type { Knex } from 'knex';
import type { UserRef } from '../contracts/fit-runs';
import {
  MAX_STORED_PERIODOGRAM_POINTS,
  type SearchEngineSettings,
  type SearchOptions,
  type SearchPeriodogram,
  type SearchResult,
  type SearchRun,
  type SearchRunStatus,
  type SearchRunSummary,
} from '../contracts/search-runs';
import { presentQueuedRunFields, type QueuedRunRow } from './queued-runs';
import { decodeFloat64Column, encodeFloat64Column } from './residual-columns';
import { userRefs } from './revisions';

export interface SearchRunRow extends QueuedRunRow<SearchRunStatus> {
  options: string | SearchOptions; // JSON column: text from MariaDB
  settings: string | SearchEngineSettings;
  companions_found: number | null;
  final_chi2: number | null;
  saved_revision_id: number | null;
}

export interface SearchPeriodogramRow {
  search_run_id: number;
  round: number;
  min_frequency_per_day: number;
  step_per_day: number;
  count: number;
  points_per_bin: number;
  power: Buffer;
}

const json = <T>(value: string | T): T => (typeof value === 'string' ? (JSON.parse(value) as T) : value);

export function presentSearchRun(row: SearchRunRow, users: Map<number, UserRef>): SearchRun {
  return {
    ...presentQueuedRunFields(row, users),
    options: json<SearchOptions>(row.options),
    settings: json<SearchEngineSettings>(row.settings),
    savedRevisionId: row.saved_revision_id,
    result: row.result_json === null ? null : (JSON.parse(row.result_json) as SearchResult),
  };
}

/** The list form: no candidate elements, no final-fit parameters, no resulting model. */
export function summariseSearchRun(run: SearchRun): SearchRunSummary {
  if (run.result === null) return { ...run, result: null };
  const { candidates, resultingModel: _model, finalFit, ...rest } = run.result;
  const { parameters: _parameters, ...fitFigures } = finalFit;
  return {
    ...run,
    result: { ...rest, finalFit: fitFigures, candidates: candidates.map(({ elements: _elements, ...c }) => c) },
  };
}

export async function presentSearchRuns(knex: Knex, rows: readonly SearchRunRow[]): Promise<SearchRun[]> {
  const users = await userRefs(knex, rows.map((r) => r.requested_by));
  return rows.map((r) => presentSearchRun(r, users));
}

export async function findSearchRun(knex: Knex | Knex.Transaction, id: number): Promise<SearchRunRow | undefined> {
  return (await knex<SearchRunRow>('search_runs').where({ id }).first()) as SearchRunRow | undefined;
}

/** A periodogram as the engine computed it (every grid frequency). */
export interface RawSearchPeriodogram {
  round: number;
  grid: SearchPeriodogram['grid'];
  power: Float64Array;
}

/**
 * Max-pools `power` into bins of `k` consecutive values (the last bin may be shorter).
 *
 * @returns  ceil(n / k) values, each the highest power of its bin
 */
export function maxPool(power: Float64Array, k: number): Float64Array {
  const out = new Float64Array(Math.ceil(power.length / k));
  for (let b = 0; b < out.length; b++) {
    let best = -Infinity;
    for (let i = b * k; i < Math.min(power.length, (b + 1) * k); i++) if (power[i] > best) best = power[i];
    out[b] = best;
  }
  return out;
}

/**
 * One round's periodogram as its stored row (power deflated). Longer than
 * `maxPoints`: max-pooled into bins of k = ceil(count / maxPoints) grid points
 * (migration 20261203100200).
 */
export function encodeSearchPeriodogram(searchRunId: number, p: RawSearchPeriodogram, maxPoints = MAX_STORED_PERIODOGRAM_POINTS): SearchPeriodogramRow {
  if (p.power.length !== p.grid.count) throw new RangeError(`encodeSearchPeriodogram: ${p.power.length} powers for a grid of ${p.grid.count}`);
  const k = Math.max(1, Math.ceil(p.grid.count / maxPoints));
  const power = k === 1 ? p.power : maxPool(p.power, k);
  return {
    search_run_id: searchRunId,
    round: p.round,
    min_frequency_per_day: p.grid.minFrequencyPerDay,
    step_per_day: p.grid.stepPerDay * k,
    count: power.length,
    points_per_bin: k,
    power: encodeFloat64Column(power),
  };
}

export function decodeSearchPeriodogram(row: SearchPeriodogramRow): SearchPeriodogram {
  const count = Number(row.count);
  return {
    round: row.round,
    grid: { minFrequencyPerDay: row.min_frequency_per_day, stepPerDay: row.step_per_day, count },
    pointsPerBin: Number(row.points_per_bin),
    power: Array.from(decodeFloat64Column(row.power, count)),
  };
}

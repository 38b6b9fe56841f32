/**
 * The residual periodograms of a finished search run, one per round, from
 * search_periodograms, each with the power of the run's false-alarm threshold
 * (kept on the round's peak in the result JSON; null for runs stored before it
 * was kept). 404 for an unknown run, 409 `no_periodograms` when the run has
 * none (not succeeded).
 */
import type { Knex } from 'knex';
import type { SearchOptions, SearchPeriodograms, SearchResult } from '../../contracts/search-runs';
import { decodeSearchPeriodogram, type SearchPeriodogramRow } from '../../db/search-runs';
import { AppError, notFound } from '../../errors';

export async function getSearchPeriodograms(knex: Knex, searchRunId: number): Promise<SearchPeriodograms> {
  const run = (await knex('search_runs').where({ id: searchRunId }).first('id', 'status', 'options', 'result_json')) as
    | { id: number; status: string; options: string | SearchOptions; result_json: string | null }
    | undefined;
  if (!run) throw notFound('search run');
  if (run.status !== 'succeeded') throw new AppError(409, 'no_periodograms', `search run ${searchRunId} has no periodograms (status ${run.status})`);
  const rows = (await knex('search_periodograms').where({ search_run_id: searchRunId }).orderBy('round')) as SearchPeriodogramRow[];
  const result = run.result_json === null ? null : (JSON.parse(run.result_json) as SearchResult);
  const options = typeof run.options === 'string' ? (JSON.parse(run.options) as SearchOptions) : run.options;
  const thresholdPowers = new Map((result?.peaks ?? []).map((p) => [p.round, p.thresholdPower ?? null]));
  return {
    searchRunId,
    falseAlarmThreshold: result?.searchSettings.falseAlarmThreshold ?? options.falseAlarmThreshold,
    rounds: rows.map((row) => ({ ...decodeSearchPeriodogram(row), thresholdPower: thresholdPowers.get(row.round) ?? null })),
  };
}

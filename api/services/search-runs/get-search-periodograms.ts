/**
 * The residual periodograms of a finished search run, one per round, from
 * search_periodograms. 404 for an unknown run, 409 `no_periodograms` when the
 * run has none (not succeeded).
 */
import type { Knex } from 'knex';
import type { SearchPeriodograms } from '../../contracts/search-runs';
import { decodeSearchPeriodogram, type SearchPeriodogramRow } from '../../db/search-runs';
import { AppError, notFound } from '../../errors';

export async function getSearchPeriodograms(knex: Knex, searchRunId: number): Promise<SearchPeriodograms> {
  const run = (await knex('search_runs').where({ id: searchRunId }).first('id', 'status')) as { id: number; status: string } | undefined;
  if (!run) throw notFound('search run');
  if (run.status !== 'succeeded') throw new AppError(409, 'no_periodograms', `search run ${searchRunId} has no periodograms (status ${run.status})`);
  const rows = (await knex('search_periodograms').where({ search_run_id: searchRunId }).orderBy('round')) as SearchPeriodogramRow[];
  return { searchRunId, rounds: rows.map(decodeSearchPeriodogram) };
}

/** One search run (with its full result), or 404. */
import type { Knex } from 'knex';
import type { SearchRun } from '../../contracts/search-runs';
import { findSearchRun, presentSearchRuns } from '../../db/search-runs';
import { notFound } from '../../errors';

export async function getSearchRun(knex: Knex, id: number): Promise<SearchRun> {
  const row = await findSearchRun(knex, id);
  if (!row) throw notFound('search run');
  return (await presentSearchRuns(knex, [row]))[0];
}

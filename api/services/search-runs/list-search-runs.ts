/** A pulsar's search runs, newest first, as summaries (no elements, no final-fit parameters, no model); 404 for an unknown pulsar. */
import type { Knex } from 'knex';
import type { SearchRunSummary } from '../../contracts/search-runs';
import { presentSearchRuns, summariseSearchRun, type SearchRunRow } from '../../db/search-runs';
import { notFound } from '../../errors';

export async function listSearchRuns(knex: Knex, pulsarId: number): Promise<SearchRunSummary[]> {
  const pulsar = await knex('pulsars').where({ id: pulsarId }).first('id');
  if (!pulsar) throw notFound('pulsar');
  const rows = (await knex('search_runs').where({ pulsar_id: pulsarId }).orderBy('id', 'desc')) as SearchRunRow[];
  return (await presentSearchRuns(knex, rows)).map(summariseSearchRun);
}

/** A pulsar's fit runs, newest first, as summaries (no parameters, no fitted model); 404 for an unknown pulsar. */
import type { Knex } from 'knex';
import type { FitRunSummary } from '../../contracts/fit-runs';
import { presentFitRuns, summariseFitRun, type FitRunRow } from '../../db/fit-runs';
import { notFound } from '../../errors';

export async function listFitRuns(knex: Knex, pulsarId: number): Promise<FitRunSummary[]> {
  const pulsar = await knex('pulsars').where({ id: pulsarId }).first('id');
  if (!pulsar) throw notFound('pulsar');
  const rows = (await knex('fit_runs').where({ pulsar_id: pulsarId }).orderBy('id', 'desc')) as FitRunRow[];
  return (await presentFitRuns(knex, rows)).map(summariseFitRun);
}

/** One fit run (with its full result), or 404. */
import type { Knex } from 'knex';
import type { FitRun } from '../../contracts/fit-runs';
import { findFitRun, presentFitRuns } from '../../db/fit-runs';
import { notFound } from '../../errors';

export async function getFitRun(knex: Knex, id: number): Promise<FitRun> {
  const row = await findFitRun(knex, id);
  if (!row) throw notFound('fit run');
  return (await presentFitRuns(knex, [row]))[0];
}

/** Computes the comparison of 2–4 succeeded fit runs of one pulsar from their stored results (nothing is stored). */
import type { Knex } from 'knex';
import type { FitComparison } from '../../contracts/comparisons';
import { buildFitComparison } from './build-fit-comparison';
import { loadComparedRuns } from './load-compared-runs';

/**
 * @param fitRunIds  reference run first
 * @param field      request path of the ids for error details
 * Throws 404 for an unknown pulsar; 400 for runs of another pulsar or runs that have not succeeded.
 */
export async function getFitComparison(knex: Knex, pulsarId: number, fitRunIds: readonly number[], field: (string | number)[] = ['query', 'runs']): Promise<FitComparison> {
  return buildFitComparison(pulsarId, await loadComparedRuns(knex, pulsarId, fitRunIds, field));
}

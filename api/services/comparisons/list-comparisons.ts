/** A pulsar's saved comparisons (metadata only), newest first. */
import type { Knex } from 'knex';
import type { SavedComparison } from '../../contracts/comparisons';
import { listComparisonRows, presentComparisons } from '../../db/comparisons';
import { notFound } from '../../errors';

/** Throws 404 for an unknown pulsar. */
export async function listComparisons(knex: Knex, pulsarId: number): Promise<SavedComparison[]> {
  const pulsar = await knex('pulsars').where({ id: pulsarId }).first('id');
  if (!pulsar) throw notFound('pulsar');
  return presentComparisons(knex, await listComparisonRows(knex, pulsarId));
}

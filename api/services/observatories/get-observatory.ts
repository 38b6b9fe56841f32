/** One observatory by code, or 404. */
import type { Knex } from 'knex';
import { loadObservatories, type ObservatoryJson } from '../../db/observatories';
import { notFound } from '../../errors';

export async function getObservatory(knex: Knex, code: string): Promise<ObservatoryJson> {
  const [observatory] = await loadObservatories(knex, code);
  if (!observatory) throw notFound('observatory');
  return observatory;
}

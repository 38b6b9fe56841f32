/** Every observatory with its clock corrections, by code. */
import type { Knex } from 'knex';
import { loadObservatories, type ObservatoryJson } from '../../db/observatories';

export function listObservatories(knex: Knex): Promise<ObservatoryJson[]> {
  return loadObservatories(knex);
}

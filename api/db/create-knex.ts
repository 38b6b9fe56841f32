/** The API's knex instance, built from the shared knexfile configuration. */
import knexFactory, { type Knex } from 'knex';
import type { Config } from '../config';
import { knexConfig } from '../../knexfile';

export function createKnex(config: Config): Knex {
  return knexFactory(knexConfig(config));
}

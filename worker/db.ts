/** The worker's own database connection (the same knexfile as the API). */
import knexFactory, { type Knex } from 'knex';
import type { Config } from '../api/config';
import { knexConfig } from '../knexfile';

export function createWorkerKnex(config: Config): Knex {
  return knexFactory(knexConfig(config));
}

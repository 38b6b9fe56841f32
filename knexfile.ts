/** Knex configuration shared by the API, the worker, the scripts and the tests. */
import type { Knex } from 'knex';
import path from 'node:path';
import { loadConfig } from './api/config';

export function knexConfig(config = loadConfig()): Knex.Config {
  return {
    client: 'mysql2',
    connection: {
      host: config.db.host,
      port: config.db.port,
      user: config.db.user,
      password: config.db.password,
      database: config.db.database,
      charset: 'utf8mb4',
      supportBigNumbers: true,
      bigNumberStrings: true, // DECIMAL and BIGINT come back as exact strings
      decimalNumbers: false,
      dateStrings: false,
      timezone: 'Z',
    },
    pool: { min: 0, max: 10 },
    migrations: {
      directory: path.join(config.rootDir, 'migrations'),
      extension: 'ts',
      loadExtensions: ['.ts'],
      tableName: 'knex_migrations',
    },
  };
}

export default knexConfig();

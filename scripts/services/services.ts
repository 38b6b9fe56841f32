/** Starts and stops the private MariaDB and Redis of a profile, and runs the migrations. */
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import knexFactory from 'knex';
import { loadConfig, type Config } from '../../api/config';
import { knexConfig } from '../../knexfile';
import { resetDatabase, startMariaDb, stopMariaDb } from './mariadb';
import { startRedis, stopRedis } from './redis';

/** A session secret kept in the data folder, so sessions survive restarts of the API. */
export function ensureSessionSecret(config: Config): string {
  if (config.api.sessionSecret) return config.api.sessionSecret;
  const file = path.join(config.dataDir, 'session-secret');
  mkdirSync(config.dataDir, { recursive: true });
  if (!existsSync(file)) writeFileSync(file, randomBytes(32).toString('hex'), { mode: 0o600 });
  return readFileSync(file, 'utf8').trim();
}

export async function migrateLatest(config: Config): Promise<string[]> {
  const knex = knexFactory(knexConfig(config));
  try {
    const [, applied] = (await knex.migrate.latest()) as [number, string[]];
    return applied;
  } finally {
    await knex.destroy();
  }
}

export interface RunningServices {
  config: Config;
  /** Environment for child processes (API, worker, tests) so they find these services. */
  env: Record<string, string>;
  stop(): Promise<void>;
}

export async function startServices(options: { profile: 'dev' | 'test'; resetDatabase?: boolean }): Promise<RunningServices> {
  const baseEnv = { ...process.env, PULSEKEEPER_PROFILE: options.profile };
  const config = loadConfig(baseEnv);
  const [db, redis] = await Promise.all([startMariaDb(config), startRedis(config)]);
  if (options.resetDatabase) await resetDatabase(config);
  await migrateLatest(config);
  const env = {
    PULSEKEEPER_PROFILE: options.profile,
    PULSEKEEPER_DB_PORT: String(config.db.port),
    PULSEKEEPER_REDIS_PORT: String(config.redis.port),
    PULSEKEEPER_DATA_DIR: config.dataDir,
    PULSEKEEPER_SESSION_SECRET: ensureSessionSecret(config),
  };
  return {
    config,
    env,
    async stop() {
      await Promise.all([db.started ? stopMariaDb(config) : null, redis.started ? stopRedis(config) : null]);
    },
  };
}

/**
 * Runtime configuration, read once from the environment with defaults that
 * keep every service private: loopback addresses, non-default ports and a data
 * folder inside the checkout. Two profiles exist so that `npm test` never
 * touches the demo data of `npm start`: `dev` (start/dev) and `test`.
 */
import path from 'node:path';

export type Profile = 'dev' | 'test' | 'production';

function profileFromEnv(env: NodeJS.ProcessEnv): Profile {
  const p = env.PULSEKEEPER_PROFILE ?? (env.VITEST ? 'test' : 'dev');
  if (p !== 'dev' && p !== 'test' && p !== 'production') {
    throw new Error(`PULSEKEEPER_PROFILE: must be dev, test or production, not "${p}"`);
  }
  return p;
}

function intFromEnv(env: NodeJS.ProcessEnv, name: string, fallback: number): number {
  const raw = env[name];
  if (raw === undefined || raw === '') return fallback;
  const n = Number(raw);
  if (!Number.isInteger(n) || n <= 0 || n > 65535) throw new Error(`${name}: must be a port number, not "${raw}"`);
  return n;
}

// Defaults per profile: [mariadb, redis, api, smtp sink]. Non-default ports, so a system MariaDB/Redis can coexist.
const DEFAULT_PORTS: Record<Profile, [number, number, number, number]> = {
  dev: [3407, 6407, 4400, 2526],
  test: [3417, 6417, 4410, 2536],
  production: [3306, 6379, 4400, 25],
};

export function loadConfig(env: NodeJS.ProcessEnv = process.env) {
  const profile = profileFromEnv(env);
  const [dbPort, redisPort, apiPort, smtpPort] = DEFAULT_PORTS[profile];
  const rootDir = path.resolve(import.meta.dirname, '..');
  const dataDir = path.resolve(env.PULSEKEEPER_DATA_DIR ?? path.join(rootDir, '.data', profile));
  const host = '127.0.0.1';
  return {
    profile,
    rootDir,
    dataDir,
    db: {
      host: env.PULSEKEEPER_DB_HOST ?? host,
      port: intFromEnv(env, 'PULSEKEEPER_DB_PORT', dbPort),
      user: env.PULSEKEEPER_DB_USER ?? 'pulsekeeper',
      password: env.PULSEKEEPER_DB_PASSWORD ?? `pulsekeeper-${profile}-only`,
      database: env.PULSEKEEPER_DB_NAME ?? `pulsekeeper_${profile}`,
    },
    redis: {
      host: env.PULSEKEEPER_REDIS_HOST ?? host,
      port: intFromEnv(env, 'PULSEKEEPER_REDIS_PORT', redisPort),
    },
    api: {
      host: env.PULSEKEEPER_API_HOST ?? host,
      port: intFromEnv(env, 'PULSEKEEPER_API_PORT', apiPort),
      /** Base URL put into e-mailed links. */
      publicUrl: env.PULSEKEEPER_PUBLIC_URL ?? `http://${host}:${intFromEnv(env, 'PULSEKEEPER_API_PORT', apiPort)}`,
      /** Behind TLS (a reverse proxy), cookies are marked secure. */
      behindTls: env.PULSEKEEPER_BEHIND_TLS === '1',
      sessionSecret: env.PULSEKEEPER_SESSION_SECRET, // set by the start/test scripts; required in production
    },
    mail: {
      host: env.PULSEKEEPER_SMTP_HOST ?? host,
      port: intFromEnv(env, 'PULSEKEEPER_SMTP_PORT', smtpPort),
      /** The local SMTP sink (captures mail into the database) runs unless a real host is configured. */
      useLocalSink: env.PULSEKEEPER_SMTP_HOST === undefined,
      user: env.PULSEKEEPER_SMTP_USER,
      password: env.PULSEKEEPER_SMTP_PASSWORD,
      from: env.PULSEKEEPER_MAIL_FROM ?? 'Pulsekeeper <pulsekeeper@localhost>',
    },
    worker: {
      concurrency: intFromEnv(env, 'PULSEKEEPER_WORKER_CONCURRENCY', 2),
    },
  };
}

export type Config = ReturnType<typeof loadConfig>;

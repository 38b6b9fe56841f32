/**
 * Builds the real app against the test profile's MariaDB and Redis (started
 * by tests/setup/global-services.ts), with its own connections, and closes it.
 */
import type { Application } from 'express';
import type { Knex } from 'knex';
import type { Queue } from 'bullmq';
import type { Redis } from 'ioredis';
import { closeApp, createApp } from '../../../api/app';
import type { AppDeps } from '../../../api/app-deps';
import { loadConfig, type Config } from '../../../api/config';
import { createKnex } from '../../../api/db/create-knex';
import { createMailer } from '../../../api/mail/mailer';
import type { RateLimitSettings } from '../../../api/middleware/rate-limits';
import { createQueue, createRedis } from '../../../api/queue/create-queue';

export interface TestApp {
  app: Application;
  knex: Knex;
  redis: Redis;
  queue: Queue;
  config: Config;
  /** Unexpected errors the app logged (tests assert on them instead of printing). */
  logged: { message: string; err: unknown }[];
  close(): Promise<void>;
}

/** Limits high enough that ordinary tests never meet them; rate-limit tests lower one. */
export const RELAXED_RATE_LIMITS: RateLimitSettings = {
  windowMs: 60_000,
  signInPerIpAndEmail: 1000,
  signInPerIp: 1000,
  passwordResetPerIpAndEmail: 1000,
  passwordResetPerIp: 1000,
};

export function buildTestApp(options: { rateLimits?: Partial<RateLimitSettings>; deps?: Partial<AppDeps> } = {}): TestApp {
  const config = loadConfig();
  if (config.profile !== 'test') throw new Error(`tests must run with the test profile, not ${config.profile}`);
  const knex = options.deps?.knex ?? createKnex(config);
  const redis = options.deps?.redis ?? createRedis(config.redis);
  const queue = options.deps?.queue ?? createQueue(redis);
  const mailer = createMailer(config.mail);
  const logged: TestApp['logged'] = [];
  const app = createApp({
    knex,
    redis,
    queue,
    mailer,
    config,
    rateLimits: { ...RELAXED_RATE_LIMITS, ...options.rateLimits },
    log: (message, err) => logged.push({ message, err }),
    ...options.deps,
  });
  return {
    app,
    knex,
    redis,
    queue,
    config,
    logged,
    async close() {
      closeApp(app);
      mailer.close();
      await queue.close();
      redis.disconnect();
      await knex.destroy();
    },
  };
}

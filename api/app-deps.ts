/** What createApp needs from outside: connections, the mailer, settings. */
import type { Queue } from 'bullmq';
import type { Redis } from 'ioredis';
import type { Knex } from 'knex';
import type { Config } from './config';
import type { Mailer } from './mail/mailer';
import type { RateLimitSettings } from './middleware/rate-limits';

export interface AppDeps {
  knex: Knex;
  redis: Redis;
  queue: Queue;
  mailer: Mailer;
  config: Config;
  /** Overrides of the default rate limits (tests lower or raise them). */
  rateLimits?: Partial<RateLimitSettings>;
  /** Folder of the built client (index.html + assets); served with an SPA fallback when given and present. */
  clientDir?: string;
  /** Where unexpected errors are logged (default console.error). */
  log?: (message: string, err: unknown) => void;
}

/** What a service that e-mails links needs. */
export interface MailDeps {
  knex: Knex;
  mailer: Mailer;
  publicUrl: string;
  log: (message: string, err: unknown) => void;
}

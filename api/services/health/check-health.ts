/** Database (SELECT 1) and Redis (PING), each with a short timeout. */
import type { Redis } from 'ioredis';
import type { Knex } from 'knex';

export const HEALTH_TIMEOUT_MS = 1_000;

export interface Health {
  database: 'ok' | 'down';
  redis: 'ok' | 'down';
}

function within<T>(promise: Promise<T>, ms: number): Promise<T> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error(`timed out after ${ms} ms`)), ms);
  });
  return Promise.race([promise, timeout]).finally(() => clearTimeout(timer));
}

async function probe(check: () => Promise<unknown>): Promise<'ok' | 'down'> {
  try {
    await within(check(), HEALTH_TIMEOUT_MS);
    return 'ok';
  } catch {
    return 'down';
  }
}

export async function checkHealth(knex: Knex, redis: Redis): Promise<Health> {
  const [database, redisState] = await Promise.all([
    probe(() => knex.raw('SELECT 1')),
    probe(async () => {
      // Lost connection: answer at once instead of queueing one more PING behind the reconnect.
      // (While the first connection is still being made, the PING waits for it, up to the timeout.)
      if (['reconnecting', 'close', 'end'].includes(redis.status)) throw new Error(`redis connection is ${redis.status}`);
      if ((await redis.ping()) !== 'PONG') throw new Error('unexpected PING reply');
    }),
  ]);
  return { database, redis: redisState };
}

/**
 * The API's BullMQ client: one ioredis connection (maxRetriesPerRequest: null,
 * as BullMQ requires) and the `pulsekeeper` queue with the retry policy set
 * once, in its default job options.
 */
import { Queue } from 'bullmq';
import { Redis } from 'ioredis';
import type { Config } from '../config';
import { QUEUE_NAME } from '../contracts/queues';

export function createRedis(redis: Config['redis']): Redis {
  return new Redis({ host: redis.host, port: redis.port, maxRetriesPerRequest: null });
}

export function createQueue(connection: Redis): Queue {
  return new Queue(QUEUE_NAME, {
    connection,
    defaultJobOptions: {
      attempts: 3,
      backoff: { type: 'exponential', delay: 2_000 },
      removeOnComplete: { age: 7 * 24 * 3600, count: 1000 },
      removeOnFail: { age: 30 * 24 * 3600 },
    },
  });
}

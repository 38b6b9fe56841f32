/**
 * The worker process: one BullMQ worker on the real Redis that runs every job
 * type of the product. The API only queues; all computation happens here.
 */
import { Worker, type Job } from 'bullmq';
import IORedis from 'ioredis';
import { loadConfig } from '../api/config';
import { JOB_TYPES, QUEUE_NAME } from '../api/contracts/queues';
import { createWorkerKnex } from './db';
import { processToaStatistics } from './jobs/toa-statistics';
import { processFitRun } from './jobs/fit-run';
import { workerLockOptions } from './jobs/fit-run-worker-options';

export function startWorker(config = loadConfig()) {
  const knex = createWorkerKnex(config);
  const connection = new IORedis({ host: config.redis.host, port: config.redis.port, maxRetriesPerRequest: null });
  const processors: Record<string, (job: Job) => Promise<unknown>> = {
    [JOB_TYPES.toaStatistics]: (job) => processToaStatistics(job, { knex }),
    [JOB_TYPES.fitRun]: (job) => processFitRun(job, { knex }),
  };
  const worker = new Worker(
    QUEUE_NAME,
    async (job) => {
      const processor = processors[job.name];
      if (!processor) throw new Error(`unknown job type "${job.name}"`);
      return processor(job);
    },
    { connection, concurrency: config.worker.concurrency, ...workerLockOptions() },
  );
  worker.on('failed', (job, err) => {
    if (job && job.attemptsMade >= (job.opts.attempts ?? 1)) {
      console.error(`job ${job.id} (${job.name}) failed: ${err.message}`);
    }
  });
  return {
    worker,
    async close() {
      await worker.close();
      await connection.quit();
      await knex.destroy();
    },
  };
}

const isMain = process.argv[1] && import.meta.filename === (await import('node:fs')).realpathSync(process.argv[1]);
if (isMain) {
  const running = startWorker();
  console.log(`worker: listening on queue "${QUEUE_NAME}"`);
  const shutdown = async () => {
    await running.close();
    process.exit(0);
  };
  process.on('SIGINT', shutdown);
  process.on('SIGTERM', shutdown);
}

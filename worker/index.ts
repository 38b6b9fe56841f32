/**
 * The worker process: one BullMQ worker on the real Redis that runs every job
 * type of the product. The API only queues; all computation happens here.
 */
import { Worker, type Job } from 'bullmq';
import IORedis from 'ioredis';
import { loadConfig } from '../api/config';
import { CAMPAIGN_JOB_TYPE, JOB_TYPES, QUEUE_NAME, SEARCH_RUN_JOB_TYPE } from '../api/contracts/queues';
import { createMailer } from '../api/mail/mailer';
import { createQueue } from '../api/queue/create-queue';
import { createFitRun } from '../api/services/fit-runs/create-fit-run';
import { createWorkerKnex } from './db';
import { processToaStatistics } from './jobs/toa-statistics';
import { processFitRun } from './jobs/fit-run';
import { processSearchRun } from './jobs/search-run';
import { workerLockOptions } from './jobs/fit-run-worker-options';
import { processCampaign } from './jobs/campaign';
import { failCampaign } from './jobs/campaign-failure';
import { onFitRunFinished } from './jobs/fit-run-events';
import { notifyFitRunFinished } from './jobs/notify-fit-run-finished';

export function startWorker(config = loadConfig()) {
  const knex = createWorkerKnex(config);
  const connection = new IORedis({ host: config.redis.host, port: config.redis.port, maxRetriesPerRequest: null });
  // Campaigns queue fit runs and mail their followers (worker/jobs/campaign.ts, notify-*.ts).
  const queue = createQueue(connection);
  const mailer = createMailer(config.mail);
  const mail = { knex, mailer, publicUrl: config.api.publicUrl, log: (message: string, err: unknown) => console.error(message, err) };
  const stopFitNotices = onFitRunFinished(async (event) => {
    await notifyFitRunFinished(mail, event.fitRunId);
  });
  const processors: Record<string, (job: Job, token?: string) => Promise<unknown>> = {
    [JOB_TYPES.toaStatistics]: (job) => processToaStatistics(job, { knex }),
    [JOB_TYPES.fitRun]: (job) => processFitRun(job, { knex }),
    [SEARCH_RUN_JOB_TYPE]: (job) => processSearchRun(job, { knex }),
    [CAMPAIGN_JOB_TYPE]: (job, token) => processCampaign(job, token, { knex, queue, createFitRun, mail }),
  };
  const worker = new Worker(
    QUEUE_NAME,
    async (job, token) => {
      const processor = processors[job.name];
      if (!processor) throw new Error(`unknown job type "${job.name}"`);
      return processor(job, token);
    },
    { connection, concurrency: config.worker.concurrency, ...workerLockOptions() },
  );
  worker.on('failed', (job, err) => {
    if (job && job.attemptsMade >= (job.opts.attempts ?? 1)) {
      console.error(`job ${job.id} (${job.name}) failed: ${err.message}`);
    }
    if (job?.name === CAMPAIGN_JOB_TYPE && job.finishedOn && Number.isInteger(job.data?.campaignId)) {
      // Failed for good (retries exhausted or unrecoverable): the campaign row says so and its followers hear of it.
      void failCampaign({ knex, mail }, job.data.campaignId, err.message).catch((e) => console.error(`campaign job ${job.id}: could not record the failure`, e));
    }
  });
  return {
    worker,
    async close() {
      await worker.close();
      stopFitNotices();
      await queue.close();
      mailer.close();
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

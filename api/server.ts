/**
 * The API process: config → knex, Redis + queue, mailer (+ the local SMTP sink
 * when no real host is configured) → createApp → listen. Serves the built
 * client from dist/ when present. SIGINT/SIGTERM close everything in order.
 */
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { closeApp, createApp } from './app';
import { loadConfig } from './config';
import { createKnex } from './db/create-knex';
import { createMailer } from './mail/mailer';
import { startSmtpSink, type SmtpSink } from './mail/smtp-sink';
import { createQueue, createRedis } from './queue/create-queue';

export interface RunningApi {
  url: string;
  stop(): Promise<void>;
}

export async function startApi(env: NodeJS.ProcessEnv = process.env): Promise<RunningApi> {
  const config = loadConfig(env);
  const knex = createKnex(config);
  const redis = createRedis(config.redis);
  const queue = createQueue(redis);
  const mailer = createMailer(config.mail);
  let sink: SmtpSink | undefined;
  if (config.mail.useLocalSink) sink = await startSmtpSink({ knex, host: config.mail.host, port: config.mail.port });

  const app = createApp({ knex, redis, queue, mailer, config, clientDir: path.join(config.rootDir, 'dist') });
  const server = app.listen(config.api.port, config.api.host);
  await new Promise<void>((resolve, reject) => {
    server.once('listening', resolve);
    server.once('error', reject);
  });
  const address = server.address() as AddressInfo;

  return {
    url: `http://${address.address}:${address.port}`,
    async stop() {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      closeApp(app);
      await sink?.close();
      mailer.close();
      await queue.close();
      await redis.quit().catch(() => redis.disconnect());
      await knex.destroy();
    },
  };
}

const isMain = process.argv[1] && path.resolve(process.argv[1]) === path.resolve(import.meta.filename);
if (isMain) {
  const api = await startApi();
  console.log(`Pulsekeeper API listening on ${api.url}`);
  let stopping = false;
  const shutdown = (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`${signal}: shutting down`);
    api.stop().then(
      () => process.exit(0),
      (err: unknown) => {
        console.error('shutdown failed', err);
        process.exit(1);
      },
    );
  };
  process.on('SIGINT', () => shutdown('SIGINT'));
  process.on('SIGTERM', () => shutdown('SIGTERM'));
}

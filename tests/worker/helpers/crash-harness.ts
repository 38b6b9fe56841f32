/**
 * Harness of the worker crash tests: a test app, a signed-in analyst, and
 * worker processes started as children (`node --import tsx worker/index.ts`,
 * one process each, so SIGKILL hits the worker itself) with short lock and
 * stall times, so stall detection takes a killed worker's job back quickly.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { signedInClient, type Client } from '../../api/helpers/agents';
import { createUser } from '../../api/helpers/factories';
import { buildTestApp, type TestApp } from '../../api/helpers/test-app';

const CHILD_ENV = { PULSEKEEPER_PROFILE: 'test', PULSEKEEPER_WORKER_LOCK_MS: '5000', PULSEKEEPER_WORKER_STALLED_INTERVAL_MS: '2000' };

export interface CrashHarness {
  t: TestApp;
  analyst: Client;
  /** Starts a worker process (its output is drained, not shown). */
  startWorkerProcess(): ChildProcess;
  /** Stops the worker processes still running (SIGTERM, waiting for each), then the test app. */
  close(): Promise<void>;
}

/** Builds the test app and signs an analyst in; call `close()` in afterAll. */
export async function startCrashHarness(): Promise<CrashHarness> {
  const t = buildTestApp();
  let analyst: Client;
  try {
    const a = await createUser(t.knex, 'analyst');
    analyst = await signedInClient(t.app, a.email, a.password);
  } catch (error) {
    await t.close();
    throw error;
  }
  const children: ChildProcess[] = [];
  return {
    t,
    analyst,
    startWorkerProcess() {
      const child = spawn(process.execPath, ['--import', 'tsx', 'worker/index.ts'], {
        cwd: t.config.rootDir,
        env: { ...process.env, ...CHILD_ENV },
        stdio: ['ignore', 'pipe', 'pipe'],
      });
      child.stdout?.resume();
      child.stderr?.resume();
      children.push(child);
      return child;
    },
    async close() {
      for (const child of children) {
        if (child.exitCode === null && child.signalCode === null) {
          child.kill('SIGTERM');
          await new Promise((resolve) => child.once('exit', resolve));
        }
      }
      await t.close();
    },
  };
}

/** Polls `check` every 50 ms; throws "timed out waiting for <what>" after `timeoutMs`. */
export async function waitFor(what: string, check: () => Promise<boolean>, timeoutMs: number): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}

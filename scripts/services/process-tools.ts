/** Small helpers for the private service processes started by the start/test scripts. */
import { execFile } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import { promisify } from 'node:util';

export const run = promisify(execFile);

export function sleep(ms: number): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve, ms));
}

/** The pid in a pid file, if that process is alive. */
export function livePid(pidFile: string): number | null {
  if (!existsSync(pidFile)) return null;
  const pid = Number(readFileSync(pidFile, 'utf8').trim());
  if (!Number.isInteger(pid) || pid <= 0) return null;
  try {
    process.kill(pid, 0);
    return pid;
  } catch {
    return null;
  }
}

/** A service that cannot start at all (it exited); waiting longer would not help. */
export class ServiceStartError extends Error {}

/** The last error lines of a server log, for start-up failures (e.g. a port already in use). */
export function logTail(logFile: string, lines = 3): string {
  if (!existsSync(logFile)) return '(no log)';
  const errors = readFileSync(logFile, 'utf8').split('\n').filter((l) => /ERROR|error/.test(l));
  return errors.slice(-lines).join(' | ') || '(see the log)';
}

/** Polls `probe` until it resolves true, or throws after `timeoutMs` with `what` in the message. */
export async function waitFor(what: string, probe: () => Promise<boolean>, timeoutMs = 30_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const ready = await probe().catch((error: unknown) => {
      if (error instanceof ServiceStartError) throw error;
      return false;
    });
    if (ready) return;
    await sleep(100);
  }
  throw new Error(`${what} did not become ready within ${timeoutMs / 1000} s`);
}

export async function waitForExit(pid: number, timeoutMs = 15_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    try {
      process.kill(pid, 0);
    } catch {
      return;
    }
    await sleep(100);
  }
  process.kill(pid, 'SIGKILL');
}

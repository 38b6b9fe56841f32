/**
 * BullMQ lock and stall settings of the worker, from the environment:
 * PULSEKEEPER_WORKER_LOCK_MS (lockDuration, default 30 000 ms) and
 * PULSEKEEPER_WORKER_STALLED_INTERVAL_MS (stalledInterval, default 30 000 ms).
 * A job whose worker dies (SIGKILL) loses its lock after lockDuration and is
 * moved back to the queue by the next stall check; tests use 5 s and 2 s.
 * Fits run in a worker thread (fit-run-thread.ts), so lock renewal never waits
 * for the engine.
 */
function positiveMs(env: NodeJS.ProcessEnv, name: string, fallback: number): number {
  const raw = env[name];
  if (raw === undefined || raw === '') return fallback;
  const n = Number(raw);
  if (!Number.isInteger(n) || n < 100) throw new Error(`${name}: must be a whole number of milliseconds ≥ 100, not "${raw}"`);
  return n;
}

export function workerLockOptions(env: NodeJS.ProcessEnv = process.env): { lockDuration: number; stalledInterval: number } {
  return {
    lockDuration: positiveMs(env, 'PULSEKEEPER_WORKER_LOCK_MS', 30_000),
    stalledInterval: positiveMs(env, 'PULSEKEEPER_WORKER_STALLED_INTERVAL_MS', 30_000),
  };
}

/**
 * Runs a fit in a worker thread, so the worker's event loop stays free while
 * the engine computes: BullMQ keeps renewing the job lock (a fit of 100 000
 * TOAs blocks for tens of seconds, longer than a short lockDuration), progress
 * reaches the database while the fit runs, and a cancelled fit is stopped at
 * once by terminating the thread.
 *
 * The thread loads its TypeScript through tsx's loader (registered inside the
 * thread), so it works both under `tsx worker/index.ts` and inside Vitest.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { Worker } from 'node:worker_threads';
import type { FitEngineInput, FitEngineOutput } from './fit-run-engine';

export type FitThreadMessage =
  | { type: 'stage'; stage: 'barycentring' | 'fitting' }
  | { type: 'iteration'; iteration: number; chi2: number }
  | { type: 'done'; output: FitEngineOutput }
  | { type: 'error'; timingInput: boolean; message: string };

export type FitThreadEvent = Extract<FitThreadMessage, { type: 'stage' | 'iteration' }>;

/** An engine failure reported by the thread; `timingInput` marks the engine's TimingInputError (bad input, no retry). */
export class FitThreadError extends Error {
  constructor(message: string, readonly timingInput: boolean) {
    super(message);
    this.name = 'FitThreadError';
  }
}

const ENTRY_URL = pathToFileURL(path.join(import.meta.dirname, 'fit-run-thread-entry.ts')).href;
const TSX_API_URL = tsxEsmApiUrl();

/** URL of tsx's ES-module API (`tsx/esm/api`, import condition): its CommonJS twin cannot register from a thread. */
function tsxEsmApiUrl(): string {
  const manifestPath = createRequire(import.meta.url).resolve('tsx/package.json');
  const manifest = JSON.parse(readFileSync(manifestPath, 'utf8')) as { exports: Record<string, { import: { default: string } }> };
  return pathToFileURL(path.join(path.dirname(manifestPath), manifest.exports['./esm/api'].import.default)).href;
}

// CommonJS bootstrap (eval): register tsx in this thread, then import the TypeScript entry.
const BOOTSTRAP = `
const { workerData } = require('node:worker_threads');
import(workerData.tsxApiUrl).then((tsx) => { tsx.register(); return import(workerData.entryUrl); })
  .catch((error) => { require('node:worker_threads').parentPort.postMessage({ type: 'error', timingInput: false, message: 'fit thread failed to start: ' + (error && error.message) }); });
`;

export interface RunningFitThread {
  /** Resolves with the engine output; rejects with FitThreadError (engine) or Error (thread died, terminated). */
  result: Promise<FitEngineOutput>;
  /** Stops the thread (cancel); `result` then rejects. */
  terminate(): Promise<void>;
}

/**
 * Starts the fit in a new thread. `onEvent` receives stage and iteration events
 * in order (it may be async; events are delivered one at a time).
 */
export function runFitInThread(input: FitEngineInput, onEvent: (event: FitThreadEvent) => Promise<void> | void): RunningFitThread {
  const thread = new Worker(BOOTSTRAP, {
    eval: true,
    workerData: { ...input, entryUrl: ENTRY_URL, tsxApiUrl: TSX_API_URL },
  });
  let settled = false;
  let finalMessageSeen = false;
  let events: Promise<void> = Promise.resolve();
  const result = new Promise<FitEngineOutput>((resolve, reject) => {
    const finish = (fn: () => void) => {
      if (settled) return;
      settled = true;
      fn();
    };
    thread.on('message', (message: FitThreadMessage) => {
      if (message.type === 'stage' || message.type === 'iteration') {
        events = events.then(() => onEvent(message)).catch((error: unknown) => {
          finish(() => reject(error));
          void thread.terminate();
        });
        return;
      }
      finalMessageSeen = true;
      // Deliver the last progress events before settling, so the caller sees them in order.
      void events.then(() => {
        if (message.type === 'done') finish(() => resolve(message.output));
        else finish(() => reject(new FitThreadError(message.message, message.timingInput)));
        void thread.terminate();
      });
    });
    thread.on('error', (error) => finish(() => reject(error)));
    thread.on('exit', (code) => {
      if (finalMessageSeen) return; // the message handler settles once the events are delivered
      finish(() => reject(new Error(`fit thread exited (code ${code}) before reporting a result`)));
    });
  });
  return {
    result,
    async terminate() {
      await thread.terminate();
    },
  };
}

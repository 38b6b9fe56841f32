/**
 * Runs a companion search in a worker thread, so the worker's event loop stays
 * free while the engine computes (a search is several full fits plus a
 * periodogram per round): BullMQ keeps renewing the job lock, progress reaches
 * the database meanwhile, and a cancelled search is stopped at once by
 * terminating the thread. Same mechanism as fit-run-thread.ts (tsx's loader
 * registered inside the thread, so it works under `tsx` and inside Vitest).
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { Worker } from 'node:worker_threads';
import type { SearchEngineInput, SearchEngineOutput } from './search-run-engine';

export type SearchThreadMessage =
  | { type: 'stage'; stage: 'barycentring' | 'searching' }
  | { type: 'progress'; round: number; stage: string; fraction: number }
  | { type: 'done'; output: SearchEngineOutput }
  | { type: 'error'; timingInput: boolean; message: string };

export type SearchThreadEvent = Extract<SearchThreadMessage, { type: 'stage' | 'progress' }>;

/** An engine failure reported by the thread; `timingInput` marks input without an answer (no retry). */
export class SearchThreadError extends Error {
  constructor(message: string, readonly timingInput: boolean) {
    super(message);
    this.name = 'SearchThreadError';
  }
}

const ENTRY_URL = pathToFileURL(path.join(import.meta.dirname, 'search-run-thread-entry.ts')).href;
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
  .catch((error) => { require('node:worker_threads').parentPort.postMessage({ type: 'error', timingInput: false, message: 'search thread failed to start: ' + (error && error.message) }); });
`;

export interface RunningSearchThread {
  /** Resolves with the engine output; rejects with SearchThreadError (engine) or Error (thread died, terminated, onEvent threw). */
  result: Promise<SearchEngineOutput>;
  /** Stops the thread (cancel); `result` then rejects. */
  terminate(): Promise<void>;
}

/**
 * Starts the search in a new thread. `onEvent` receives stage and progress
 * events in order (it may be async; events are delivered one at a time). When
 * it throws, the thread is terminated and `result` rejects with that error.
 */
export function runSearchInThread(input: SearchEngineInput, onEvent: (event: SearchThreadEvent) => Promise<void> | void): RunningSearchThread {
  const thread = new Worker(BOOTSTRAP, {
    eval: true,
    workerData: { ...input, entryUrl: ENTRY_URL, tsxApiUrl: TSX_API_URL },
  });
  let settled = false;
  let finalMessageSeen = false;
  let events: Promise<void> = Promise.resolve();
  const result = new Promise<SearchEngineOutput>((resolve, reject) => {
    const finish = (fn: () => void) => {
      if (settled) return;
      settled = true;
      fn();
    };
    thread.on('message', (message: SearchThreadMessage) => {
      if (message.type === 'stage' || message.type === 'progress') {
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
        else finish(() => reject(new SearchThreadError(message.message, message.timingInput)));
        void thread.terminate();
      });
    });
    thread.on('error', (error) => finish(() => reject(error)));
    thread.on('exit', (code) => {
      if (finalMessageSeen) return; // the message handler settles once the events are delivered
      finish(() => reject(new Error(`search thread exited (code ${code}) before reporting a result`)));
    });
  });
  return {
    result,
    async terminate() {
      await thread.terminate();
    },
  };
}

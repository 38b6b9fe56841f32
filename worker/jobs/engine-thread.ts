/**
 * Runs a timing engine (a fit, a companion search) in a worker thread, so the
 * worker's event loop stays free while the engine computes: BullMQ keeps
 * renewing the job lock (a fit of 100 000 TOAs blocks for tens of seconds,
 * longer than a short lockDuration), progress reaches the database while the
 * engine runs, and a cancelled run is stopped at once by terminating the thread.
 *
 * The thread loads its TypeScript through tsx's loader (registered inside the
 * thread), so it works both under `tsx worker/index.ts` and inside Vitest.
 *
 * Protocol: the thread's entry module receives the engine input as workerData,
 * posts any number of progress events (every message whose type is neither
 * 'done' nor 'error'), then one 'done' or 'error' message. The typed wrappers
 * are fit-run-thread.ts and search-run-thread.ts.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { Worker } from 'node:worker_threads';

/** The thread's last message: the engine output, or its failure. */
export type EngineThreadFinal<Output> = { type: 'done'; output: Output } | { type: 'error'; timingInput: boolean; message: string };

/** An engine failure reported by the thread; `timingInput` marks input without an answer (TimingInputError and the like: no retry). */
export class EngineThreadError extends Error {
  constructor(message: string, readonly timingInput: boolean) {
    super(message);
    this.name = 'EngineThreadError';
  }
}

export interface RunningEngineThread<Output> {
  /** Resolves with the engine output; rejects with EngineThreadError (engine) or Error (thread died, terminated, onEvent threw). */
  result: Promise<Output>;
  /** Stops the thread (cancel); `result` then rejects. */
  terminate(): Promise<void>;
}

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
  .catch((error) => { require('node:worker_threads').parentPort.postMessage({ type: 'error', timingInput: false, message: workerData.threadLabel + ' thread failed to start: ' + (error && error.message) }); });
`;

/**
 * Starts an engine in a new thread.
 *
 * @param entryPath  absolute path of the thread's TypeScript entry module
 * @param label      what runs, for error messages ('fit', 'search')
 * @param input      the engine input, passed as workerData (structured clone)
 * @param onEvent    receives the progress events in order (it may be async;
 *                   events are delivered one at a time). When it throws, the
 *                   thread is terminated and `result` rejects with that error.
 * @returns the running thread; the last events are delivered before `result` settles
 */
export function runEngineInThread<Input extends object, Output, Event extends { type: string }>(
  entryPath: string,
  label: string,
  input: Input,
  onEvent: (event: Event) => Promise<void> | void,
): RunningEngineThread<Output> {
  const thread = new Worker(BOOTSTRAP, {
    eval: true,
    workerData: { ...input, entryUrl: pathToFileURL(entryPath).href, tsxApiUrl: TSX_API_URL, threadLabel: label },
  });
  let settled = false;
  let finalMessageSeen = false;
  let events: Promise<void> = Promise.resolve();
  const result = new Promise<Output>((resolve, reject) => {
    const finish = (fn: () => void) => {
      if (settled) return;
      settled = true;
      fn();
    };
    thread.on('message', (message: Event | EngineThreadFinal<Output>) => {
      if (message.type !== 'done' && message.type !== 'error') {
        events = events.then(() => onEvent(message as Event)).catch((error: unknown) => {
          finish(() => reject(error));
          void thread.terminate();
        });
        return;
      }
      const final = message as EngineThreadFinal<Output>;
      finalMessageSeen = true;
      // Deliver the last progress events before settling, so the caller sees them in order.
      void events.then(() => {
        if (final.type === 'done') finish(() => resolve(final.output));
        else finish(() => reject(new EngineThreadError(final.message, final.timingInput)));
        void thread.terminate();
      });
    });
    thread.on('error', (error) => finish(() => reject(error)));
    thread.on('exit', (code) => {
      if (finalMessageSeen) return; // the message handler settles once the events are delivered
      finish(() => reject(new Error(`${label} thread exited (code ${code}) before reporting a result`)));
    });
  });
  return {
    result,
    async terminate() {
      await thread.terminate();
    },
  };
}

/**
 * Runs a fit in a worker thread (engine-thread.ts: lock renewal, progress and
 * cancel go on while the engine computes). The thread's entry is
 * fit-run-thread-entry.ts.
 */
import path from 'node:path';
import { runEngineInThread, type EngineThreadFinal, type RunningEngineThread } from './engine-thread';
import type { FitEngineInput, FitEngineOutput } from './fit-run-engine';

export type FitThreadEvent = { type: 'stage'; stage: 'barycentring' | 'fitting' } | { type: 'iteration'; iteration: number; chi2: number };

export type FitThreadMessage = FitThreadEvent | EngineThreadFinal<FitEngineOutput>;

const ENTRY_PATH = path.join(import.meta.dirname, 'fit-run-thread-entry.ts');

/**
 * Starts the fit in a new thread. `onEvent` receives stage and iteration events
 * in order (it may be async; events are delivered one at a time).
 *
 * @returns the running thread; `result` rejects with EngineThreadError for an engine failure
 */
export function runFitInThread(input: FitEngineInput, onEvent: (event: FitThreadEvent) => Promise<void> | void): RunningEngineThread<FitEngineOutput> {
  return runEngineInThread<FitEngineInput, FitEngineOutput, FitThreadEvent>(ENTRY_PATH, 'fit', input, onEvent);
}

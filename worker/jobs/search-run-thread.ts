/**
 * Runs a companion search in a worker thread (engine-thread.ts: lock renewal,
 * progress and cancel go on while the engine computes — a search is several
 * full fits plus a periodogram per round). The thread's entry is
 * search-run-thread-entry.ts.
 */
import path from 'node:path';
import { runEngineInThread, type EngineThreadFinal, type RunningEngineThread } from './engine-thread';
import type { SearchEngineInput, SearchEngineOutput } from './search-run-engine';

export type SearchThreadEvent =
  | { type: 'stage'; stage: 'barycentring' | 'searching' }
  | { type: 'progress'; round: number; stage: string; fraction: number };

export type SearchThreadMessage = SearchThreadEvent | EngineThreadFinal<SearchEngineOutput>;

const ENTRY_PATH = path.join(import.meta.dirname, 'search-run-thread-entry.ts');

/**
 * Starts the search in a new thread. `onEvent` receives stage and progress
 * events in order (it may be async; events are delivered one at a time). When
 * it throws, the thread is terminated and `result` rejects with that error.
 *
 * @returns the running thread; `result` rejects with EngineThreadError for an engine failure
 */
export function runSearchInThread(
  input: SearchEngineInput,
  onEvent: (event: SearchThreadEvent) => Promise<void> | void,
): RunningEngineThread<SearchEngineOutput> {
  return runEngineInThread<SearchEngineInput, SearchEngineOutput, SearchThreadEvent>(ENTRY_PATH, 'search', input, onEvent);
}

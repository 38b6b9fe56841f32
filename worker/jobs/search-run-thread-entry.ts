/**
 * Entry of the worker thread that runs one companion search
 * (worker/jobs/search-run-thread.ts starts it): receives a SearchEngineInput as
 * workerData, posts stage and progress messages (progress only when the round
 * or stage changes), then one 'done' or 'error' message.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { TimingInputError } from '../timing/engine-error';
import { runSearchEngine, type SearchEngineInput } from './search-run-engine';
import type { SearchThreadMessage } from './search-run-thread';

const port = parentPort;
if (port === null) throw new Error('search-run-thread-entry: must run in a worker thread');
const post = (message: SearchThreadMessage, transfer: ArrayBuffer[] = []) => port.postMessage(message, transfer);

let lastStep = '';
try {
  const output = runSearchEngine(workerData as SearchEngineInput, {
    onStage: (stage) => post({ type: 'stage', stage }),
    onProgress: ({ round, stage, fraction }) => {
      const step = `${round}:${stage}`;
      if (step === lastStep) return;
      lastStep = step;
      post({ type: 'progress', round, stage, fraction });
    },
  });
  post({ type: 'done', output }, output.periodograms.map((p) => p.power.buffer as ArrayBuffer));
} catch (error) {
  // RangeError: an argument without an answer (STYLE.md), e.g. a period range the data cannot support.
  const timingInput = error instanceof TimingInputError || error instanceof RangeError;
  post({ type: 'error', timingInput, message: (error as Error).message ?? String(error) });
}

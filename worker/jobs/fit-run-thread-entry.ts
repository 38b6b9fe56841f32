/**
 * Entry of the worker thread that runs one fit (worker/jobs/fit-run-thread.ts
 * starts it): receives a FitEngineInput as workerData, posts stage and
 * iteration messages, then one 'done' or 'error' message.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { TimingInputError } from '../timing/engine-error';
import { runFitEngine, type FitEngineInput } from './fit-run-engine';
import type { FitThreadMessage } from './fit-run-thread';

const port = parentPort;
if (port === null) throw new Error('fit-run-thread-entry: must run in a worker thread');
const post = (message: FitThreadMessage, transfer: ArrayBuffer[] = []) => port.postMessage(message, transfer);

try {
  const output = runFitEngine(workerData as FitEngineInput, {
    onStage: (stage) => post({ type: 'stage', stage }),
    onIteration: (iteration, chi2) => post({ type: 'iteration', iteration, chi2 }),
  });
  post({ type: 'done', output }, [output.residualUs.buffer as ArrayBuffer, output.uncertaintyUs.buffer as ArrayBuffer]);
} catch (error) {
  post({ type: 'error', timingInput: error instanceof TimingInputError, message: (error as Error).message ?? String(error) });
}

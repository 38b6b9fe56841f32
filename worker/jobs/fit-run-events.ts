/**
 * "A fit run has finished": listeners registered in the worker process are
 * called after the run's final status is committed (succeeded or failed; a
 * cancelled run is final when the API cancels it and calls no listener). The
 * campaign and notification jobs register here instead of polling fit_runs.
 * A listener's error is logged and never fails the fit.
 */
import type { FitRunStatus } from '../../api/contracts/fit-runs';

export interface FitRunFinished {
  fitRunId: number;
  pulsarId: number;
  campaignId: number | null;
  status: Extract<FitRunStatus, 'succeeded' | 'failed'>;
}

export type FitRunFinishedListener = (event: FitRunFinished) => Promise<void> | void;

const listeners = new Set<FitRunFinishedListener>();

/** Registers a listener; returns the function that removes it. */
export function onFitRunFinished(listener: FitRunFinishedListener): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

/** Calls every listener (in registration order), logging their errors. */
export async function notifyFitRunFinished(event: FitRunFinished): Promise<void> {
  for (const listener of [...listeners]) {
    try {
      await listener(event);
    } catch (error) {
      console.error(`fit run ${event.fitRunId}: a finished-listener failed`, error);
    }
  }
}

import { useEffect, useRef, useState } from 'react';
import type { PeriodogramAnswer } from './periodogram-messages';
import { computeResidualPeriodogram, type PeriodogramRequest, type ResidualPeriodogram } from './residual-periodogram';

/** Residuals change on every companion toggle or edit; wait this long for them to settle. */
export const PERIODOGRAM_DEBOUNCE_MS = 300;

export interface PeriodogramState {
  /** the latest finished periodogram (kept while a newer one computes) */
  result: ResidualPeriodogram | null;
  /** the engine's message when the latest request had no answer */
  error: string | null;
  /** true while a newer periodogram is waiting or computing */
  computing: boolean;
  /** where the latest one ran */
  ranIn: 'worker' | 'main thread' | null;
}

function createWorker(): Worker | null {
  if (typeof Worker === 'undefined') return null; // jsdom and very old browsers: compute on the main thread
  try {
    return new Worker(new URL('./periodogram.worker.ts', import.meta.url), { type: 'module' });
  } catch {
    return null;
  }
}

/**
 * The residual periodogram of `request`, recomputed `debounceMs` after the inputs last changed, in
 * a Web Worker when the browser has them (one worker per hook; answers to superseded requests are
 * dropped), else on the main thread.
 *
 * @param request     arrays and period range; a new object identity means new inputs
 * @param debounceMs  settling time, ms
 */
export function useResidualPeriodogram(request: PeriodogramRequest | null, debounceMs = PERIODOGRAM_DEBOUNCE_MS): PeriodogramState {
  const [state, setState] = useState<PeriodogramState>({ result: null, error: null, computing: request !== null, ranIn: null });
  const workerRef = useRef<Worker | null | undefined>(undefined);
  const latestId = useRef(0);
  const pending = useRef<PeriodogramRequest | null>(null);

  useEffect(
    () => () => {
      workerRef.current?.terminate();
      workerRef.current = undefined;
    },
    [],
  );

  useEffect(() => {
    const computeHere = (id: number, job: PeriodogramRequest) => {
      try {
        const result = computeResidualPeriodogram(job);
        if (id === latestId.current) setState({ result, error: null, computing: false, ranIn: 'main thread' });
      } catch (error) {
        if (id === latestId.current) setState({ result: null, error: error instanceof Error ? error.message : String(error), computing: false, ranIn: 'main thread' });
      }
    };
    if (request === null) {
      pending.current = null;
      setState({ result: null, error: null, computing: false, ranIn: null });
      return undefined;
    }
    const id = ++latestId.current;
    setState((old) => ({ ...old, computing: true }));
    const timer = setTimeout(() => {
      if (workerRef.current === undefined) {
        const worker = createWorker();
        workerRef.current = worker;
        worker?.addEventListener('message', (event: MessageEvent<PeriodogramAnswer>) => {
          const answer = event.data;
          if (answer.id !== latestId.current) return;
          setState('result' in answer
            ? { result: answer.result, error: null, computing: false, ranIn: 'worker' }
            : { result: null, error: answer.error, computing: false, ranIn: 'worker' });
        });
        // A worker that cannot load (blocked script, old browser) is dropped; the page computes instead.
        worker?.addEventListener('error', () => {
          worker.terminate();
          workerRef.current = null;
          if (pending.current) computeHere(latestId.current, pending.current);
        });
      }
      pending.current = request;
      const worker = workerRef.current;
      if (worker) worker.postMessage({ id, request });
      else computeHere(id, request);
    }, debounceMs);
    return () => clearTimeout(timer);
  }, [request, debounceMs]);

  return state;
}

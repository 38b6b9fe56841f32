// A module Web Worker (Vite: new Worker(new URL('./periodogram.worker.ts', import.meta.url), { type: 'module' })):
// the periodogram of 10 000 residuals takes ~0.2 s, too long for the main thread while the user toggles.
import type { PeriodogramAnswer, PeriodogramJob } from './periodogram-messages';
import { computeResidualPeriodogram } from './residual-periodogram';

const scope = self as unknown as {
  onmessage: ((event: MessageEvent<PeriodogramJob>) => void) | null;
  postMessage: (answer: PeriodogramAnswer) => void;
};

scope.onmessage = (event) => {
  const { id, request } = event.data;
  try {
    scope.postMessage({ id, result: computeResidualPeriodogram(request) });
  } catch (error) {
    scope.postMessage({ id, error: error instanceof Error ? error.message : String(error) });
  }
};

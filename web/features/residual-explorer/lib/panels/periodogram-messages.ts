import type { PeriodogramRequest, ResidualPeriodogram } from './residual-periodogram';

/** Main thread → periodogram worker. */
export interface PeriodogramJob {
  id: number;
  request: PeriodogramRequest;
}

/** Periodogram worker → main thread: the result, or the engine's message for bad input. */
export type PeriodogramAnswer = { id: number; result: ResidualPeriodogram } | { id: number; error: string };

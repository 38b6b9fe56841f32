import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export type FitRunStatus = 'queued' | 'running' | 'succeeded' | 'failed' | 'cancelled';

/** One fitted parameter; `value` and `startValue` are decimal strings, `changeSigma` = (value − start) / uncertainty. */
export interface FittedParameter {
  value: string;
  uncertainty: number;
  unit: string;
  startValue: string;
  changeSigma: number;
}

export interface FitResultSummary {
  chi2: number;
  dof: number;
  reducedChi2: number;
  weightedRmsUs: number;
  iterations: number;
  converged: boolean;
  warnings: string[];
}

export interface FitResult extends FitResultSummary {
  parameters: Record<string, FittedParameter>;
  fittedModel: unknown;
}

/** The engine settings the run used; more keys may follow. */
export interface FitSettings {
  ephemeris?: string;
  clock?: string;
  timeScale?: string;
  earthOrientation?: string;
  [key: string]: unknown;
}

/** GET /api/fit-runs/:id (docs/api-workflow.md, "Fit runs"). */
export interface FitRun<R = FitResult> {
  id: number;
  pulsarId: number;
  revisionId: number;
  campaignId: number | null;
  status: FitRunStatus;
  progress: { percent: number; stage: string } | null;
  inputsHash: string;
  settings: FitSettings;
  toaCount: number;
  excludedCount: number;
  requestedBy: { id: number; displayName: string } | null;
  queuedAt: string;
  startedAt: string | null;
  finishedAt: string | null;
  durationMs: number | null;
  errorMessage: string | null;
  result: R | null;
}

/** A list entry: the run without `result.parameters` and `result.fittedModel`. */
export type FitRunSummary = FitRun<FitResultSummary>;

/** Statuses after which a run never changes again; polling stops there. */
export const FINAL_FIT_STATUSES: ReadonlySet<FitRunStatus> = new Set(['succeeded', 'failed', 'cancelled']);
export const isFinalFitStatus = (status: FitRunStatus) => FINAL_FIT_STATUSES.has(status);

export const FIT_POLL_INTERVAL_MS = 1000;

export const fitRunKeys = {
  all: ['fit-runs'] as const,
  ofPulsar: (pulsarId: string) => ['fit-runs', 'pulsar', pulsarId] as const,
  detail: (fitRunId: string) => ['fit-runs', 'detail', fitRunId] as const,
};

export const getFitRun = (fitRunId: string) => api.get<FitRun>(`/fit-runs/${encodeURIComponent(fitRunId)}`);

export const fitRunQueryOptions = (fitRunId: string) =>
  queryOptions({
    queryKey: fitRunKeys.detail(fitRunId),
    queryFn: () => getFitRun(fitRunId),
    refetchInterval: (query) => (query.state.data && isFinalFitStatus(query.state.data.status) ? false : FIT_POLL_INTERVAL_MS),
  });

export const useFitRun = (fitRunId: string) => useQuery(fitRunQueryOptions(fitRunId));

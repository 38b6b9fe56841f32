import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type {
  FitParameterResult,
  FitResult as ApiFitResult,
  FitRun as ApiFitRun,
  FitRunStatus as ApiFitRunStatus,
  FitRunSummary as ApiFitRunSummary,
} from '../../../../api/contracts/fit-runs';

// The shapes come from the API's shared contract (api/contracts/fit-runs.ts), so a renamed field
// fails the type check here. Note there: `uncertainty` is the formal 1σ, not scaled by √χ²_red.
export type FitRunStatus = ApiFitRunStatus;
export type FittedParameter = FitParameterResult;
export type FitResult = ApiFitResult;
export type FitResultSummary = NonNullable<ApiFitRunSummary['result']>;
export type FitRun = ApiFitRun;
export type FitRunSummary = ApiFitRunSummary;
/** The engine settings a run used, as shown on the page (the contract's named keys, maybe more later). */
export type FitSettings = Record<string, unknown>;

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

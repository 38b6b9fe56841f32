import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { FIT_POLL_INTERVAL_MS, fitRunKeys, isFinalFitStatus, type FitRunSummary } from './get-fit-run';

/** Newest first. */
export const getFitRuns = (pulsarId: string) => api.get<FitRunSummary[]>(`/pulsars/${encodeURIComponent(pulsarId)}/fit-runs`);

/** Polls while any run of the pulsar is queued or running. */
export const fitRunsQueryOptions = (pulsarId: string) =>
  queryOptions({
    queryKey: fitRunKeys.ofPulsar(pulsarId),
    queryFn: () => getFitRuns(pulsarId),
    refetchInterval: (query) =>
      query.state.data && query.state.data.every((run) => isFinalFitStatus(run.status)) ? false : FIT_POLL_INTERVAL_MS,
  });

export const useFitRuns = (pulsarId: string) => useQuery(fitRunsQueryOptions(pulsarId));

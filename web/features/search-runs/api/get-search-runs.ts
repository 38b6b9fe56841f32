import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { isFinalSearchStatus, SEARCH_POLL_INTERVAL_MS, searchRunKeys, type SearchRunSummary } from './get-search-run';

/** GET /api/pulsars/:id/search-runs, newest first. */
export const getSearchRuns = (pulsarId: string) =>
  api.get<SearchRunSummary[]>(`/pulsars/${encodeURIComponent(pulsarId)}/search-runs`);

/** Polls while any search of the pulsar is queued or running. */
export const searchRunsQueryOptions = (pulsarId: string) =>
  queryOptions({
    queryKey: searchRunKeys.ofPulsar(pulsarId),
    queryFn: () => getSearchRuns(pulsarId),
    // Only while a fetched list holds an unfinished run; a failed fetch shows its error instead of retrying every second.
    refetchInterval: (query) =>
      query.state.data?.some((run) => !isFinalSearchStatus(run.status)) ? SEARCH_POLL_INTERVAL_MS : false,
  });

export const useSearchRuns = (pulsarId: string) => useQuery(searchRunsQueryOptions(pulsarId));

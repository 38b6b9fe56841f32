import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type {
  SearchCandidate as ApiSearchCandidate,
  SearchPeak as ApiSearchPeak,
  SearchResult as ApiSearchResult,
  SearchRun as ApiSearchRun,
  SearchRunStatus as ApiSearchRunStatus,
  SearchRunSummary as ApiSearchRunSummary,
} from '../../../../api/contracts/search-runs';

// The shapes come from the API's shared contract (api/contracts/search-runs.ts), so a renamed
// field fails the type check here.
export type SearchRunStatus = ApiSearchRunStatus;
export type SearchRun = ApiSearchRun;
export type SearchRunSummary = ApiSearchRunSummary;
export type SearchResult = ApiSearchResult;
export type SearchPeak = ApiSearchPeak;
export type SearchCandidate = ApiSearchCandidate;

/** Statuses after which a run never changes again; polling stops there. */
export const FINAL_SEARCH_STATUSES: ReadonlySet<SearchRunStatus> = new Set(['succeeded', 'failed', 'cancelled']);
export const isFinalSearchStatus = (status: SearchRunStatus) => FINAL_SEARCH_STATUSES.has(status);

export const SEARCH_POLL_INTERVAL_MS = 1000;

export const searchRunKeys = {
  all: ['search-runs'] as const,
  ofPulsar: (pulsarId: string) => ['search-runs', 'pulsar', pulsarId] as const,
  detail: (searchRunId: string) => ['search-runs', 'detail', searchRunId] as const,
  periodograms: (searchRunId: string) => ['search-runs', 'periodograms', searchRunId] as const,
};

/** GET /api/search-runs/:id → the run with its result once it succeeded. */
export const getSearchRun = (searchRunId: string) => api.get<SearchRun>(`/search-runs/${encodeURIComponent(searchRunId)}`);

/** Polls every second while the fetched run is unfinished (not after a failed fetch). */
export const searchRunQueryOptions = (searchRunId: string) =>
  queryOptions({
    queryKey: searchRunKeys.detail(searchRunId),
    queryFn: () => getSearchRun(searchRunId),
    refetchInterval: (query) => (query.state.data && !isFinalSearchStatus(query.state.data.status) ? SEARCH_POLL_INTERVAL_MS : false),
  });

export const useSearchRun = (searchRunId: string) => useQuery(searchRunQueryOptions(searchRunId));

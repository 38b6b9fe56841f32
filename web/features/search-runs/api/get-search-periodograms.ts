import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { SearchPeriodograms } from '../../../../api/contracts/search-runs';
import { searchRunKeys } from './get-search-run';

export type { SearchPeriodogram, SearchPeriodograms } from '../../../../api/contracts/search-runs';

/** GET /api/search-runs/:id/periodograms → one periodogram per round on its regular frequency grid. */
export const getSearchPeriodograms = (searchRunId: string) =>
  api.get<SearchPeriodograms>(`/search-runs/${encodeURIComponent(searchRunId)}/periodograms`);

// Stored once the run succeeded and never changed afterwards.
export const searchPeriodogramsQueryOptions = (searchRunId: string) =>
  queryOptions({
    queryKey: searchRunKeys.periodograms(searchRunId),
    queryFn: () => getSearchPeriodograms(searchRunId),
    staleTime: Infinity,
  });

/** Fetches only when `enabled` (the run succeeded). */
export const useSearchPeriodograms = (searchRunId: string, enabled = true) =>
  useQuery({ ...searchPeriodogramsQueryOptions(searchRunId), enabled });

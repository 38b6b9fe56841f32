import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { searchRunKeys, type SearchRun } from './get-search-run';

/** POST /api/search-runs/:id/cancel → the run, now `cancelled` (409 when already final). */
export const cancelSearchRun = (searchRunId: string) => api.post<SearchRun>(`/search-runs/${encodeURIComponent(searchRunId)}/cancel`);

export function useCancelSearchRun(searchRunId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => cancelSearchRun(searchRunId),
    onSuccess: (run) => {
      queryClient.setQueryData(searchRunKeys.detail(searchRunId), run);
      return queryClient.invalidateQueries({ queryKey: searchRunKeys.all });
    },
  });
}

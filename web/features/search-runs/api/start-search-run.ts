import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { CreateSearchRunBody, CreateSearchRunResponse } from '../../../../api/contracts/search-runs';
import { searchRunKeys } from './get-search-run';

/**
 * POST /api/pulsars/:id/search-runs → 202 `{ searchRun, reused: false }` when queued;
 * 200 `{ searchRun, reused: true }` when identical inputs already succeeded (nothing queued).
 */
export const startSearchRun = (pulsarId: string, body: CreateSearchRunBody) =>
  api.post<CreateSearchRunResponse>(`/pulsars/${encodeURIComponent(pulsarId)}/search-runs`, body);

export function useStartSearchRun(pulsarId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateSearchRunBody) => startSearchRun(pulsarId, body),
    onSuccess: (answer) => {
      queryClient.setQueryData(searchRunKeys.detail(String(answer.searchRun.id)), answer.searchRun);
      return queryClient.invalidateQueries({ queryKey: searchRunKeys.ofPulsar(pulsarId) });
    },
  });
}

import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SaveComparisonBody, SavedComparisonWithResult } from '../../../../api/contracts/comparisons';
import { api } from '../../../lib/api-client';
import { comparisonKeys } from './get-fit-comparison';

/** POST /api/pulsars/:id/comparisons (lead and up): 201 with the saved comparison and its result. */
export const saveComparison = (pulsarId: string, body: SaveComparisonBody) =>
  api.post<SavedComparisonWithResult>(`/pulsars/${encodeURIComponent(pulsarId)}/comparisons`, body);

export function useSaveComparison(pulsarId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: SaveComparisonBody) => saveComparison(pulsarId, body),
    onSuccess: (saved) => {
      queryClient.setQueryData(comparisonKeys.saved(String(saved.id)), saved);
      return queryClient.invalidateQueries({ queryKey: comparisonKeys.savedOfPulsar(pulsarId) });
    },
  });
}

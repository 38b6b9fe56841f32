import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { pulsarKeys } from '../../pulsars/api/get-pulsars';
import { fitRunKeys, type FitRun } from './get-fit-run';

/** POST /api/fit-runs/:id/cancel → the run, now `cancelled` (409 when already final). */
export const cancelFitRun = (fitRunId: string) => api.post<FitRun>(`/fit-runs/${encodeURIComponent(fitRunId)}/cancel`);

export function useCancelFitRun(fitRunId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => cancelFitRun(fitRunId),
    onSuccess: (run) => {
      queryClient.setQueryData(fitRunKeys.detail(fitRunId), run);
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: fitRunKeys.all }),
        queryClient.invalidateQueries({ queryKey: pulsarKeys.all }),
      ]);
    },
  });
}

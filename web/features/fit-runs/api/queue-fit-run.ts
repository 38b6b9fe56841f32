import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { pulsarKeys } from '../../pulsars/api/get-pulsars';
import { fitRunKeys, type FitRun } from './get-fit-run';

export interface QueueFitRunBody {
  revisionId: number;
  recompute?: boolean;
}

/** 202 `{ fitRun, reused: false }` when queued; 200 `{ fitRun, reused: true }` when identical inputs already succeeded. */
export interface QueueFitRunAnswer {
  fitRun: FitRun;
  reused: boolean;
}

export const queueFitRun = (pulsarId: string, body: QueueFitRunBody) =>
  api.post<QueueFitRunAnswer>(`/pulsars/${encodeURIComponent(pulsarId)}/fit-runs`, body);

export function useQueueFitRun(pulsarId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: QueueFitRunBody) => queueFitRun(pulsarId, body),
    onSuccess: (answer) => {
      if (answer.reused) return undefined;
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: fitRunKeys.all }),
        queryClient.invalidateQueries({ queryKey: pulsarKeys.all }),
      ]);
    },
  });
}

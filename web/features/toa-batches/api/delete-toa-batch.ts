import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { pulsarKeys } from '../../pulsars/api/get-pulsars';
import { toaBatchKeys } from './get-toa-batches';

/** Deletes a batch and its TOAs (DELETE /api/toa-batches/:id, 204). */
export const deleteToaBatch = (batchId: number) => api.delete(`/toa-batches/${encodeURIComponent(String(batchId))}`);

export function useDeleteToaBatch() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteToaBatch,
    // The pulsar's counts and span change with its TOAs.
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: toaBatchKeys.all }),
        queryClient.invalidateQueries({ queryKey: pulsarKeys.all }),
      ]),
  });
}

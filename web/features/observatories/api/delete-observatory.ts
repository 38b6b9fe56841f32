import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { observatoryKeys } from './get-observatories';

export const deleteObservatory = (code: string) => api.delete(`/observatories/${encodeURIComponent(code)}`);

export function useDeleteObservatory() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteObservatory,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: observatoryKeys.all }),
  });
}

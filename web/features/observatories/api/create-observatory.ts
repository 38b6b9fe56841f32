import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { observatoryKeys, type Observatory } from './get-observatories';

export const createObservatory = (body: Observatory) => api.post<Observatory>('/observatories', body);

export function useCreateObservatory() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createObservatory,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: observatoryKeys.all }),
  });
}

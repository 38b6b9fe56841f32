import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { CreatePulsarBody } from '../pulsar-rules';
import { pulsarKeys, type Pulsar } from './get-pulsars';

export const createPulsar = (body: CreatePulsarBody) => api.post<Pulsar>('/pulsars', body);

export function useCreatePulsar() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createPulsar,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: pulsarKeys.all }),
  });
}

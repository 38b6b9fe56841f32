import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { observatoryKeys, type Observatory } from './get-observatories';

/** Everything but the code, which identifies the observatory and cannot change. */
export type ObservatoryPatch = Partial<Omit<Observatory, 'code'>>;

export const updateObservatory = (code: string, patch: ObservatoryPatch) =>
  api.patch<Observatory>(`/observatories/${encodeURIComponent(code)}`, patch);

export function useUpdateObservatory() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ code, patch }: { code: string; patch: ObservatoryPatch }) => updateObservatory(code, patch),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: observatoryKeys.all }),
  });
}

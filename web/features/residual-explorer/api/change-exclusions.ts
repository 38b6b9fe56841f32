import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ExcludeToasBody, RestoreToasBody } from '../../../../api/contracts/toas';
import { api } from '../../../lib/api-client';
import { pulsarKeys } from '../../pulsars/api/get-pulsars';
import { exclusionKeys } from './get-exclusions';

/** POST /api/pulsars/:id/exclusions → 201 `{ excluded }` (docs/api-workflow.md). */
export const excludeToas = (pulsarId: string, body: ExcludeToasBody) =>
  api.post<{ excluded: number }>(`/pulsars/${encodeURIComponent(pulsarId)}/exclusions`, body);

/** POST /api/pulsars/:id/exclusions/restore → 200 `{ restored }`; the history rows are kept. */
export const restoreToas = (pulsarId: string, body: RestoreToasBody) =>
  api.post<{ restored: number }>(`/pulsars/${encodeURIComponent(pulsarId)}/exclusions/restore`, body);

/** One change of the exclusions, as the undo list keeps it. */
export type ExclusionChange = { kind: 'exclude'; toaIds: number[]; reason: string } | { kind: 'restore'; toaIds: number[] };

/** Applies one exclusion change through the API (resolves with how many TOAs changed) and refreshes the pulsar's exclusions and counts. */
export function useChangeExclusions(pulsarId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (change: ExclusionChange): Promise<number> =>
      change.kind === 'exclude'
        ? (await excludeToas(pulsarId, { toaIds: change.toaIds, reason: change.reason })).excluded
        : (await restoreToas(pulsarId, { toaIds: change.toaIds })).restored,
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: exclusionKeys.ofPulsar(pulsarId) }),
        queryClient.invalidateQueries({ queryKey: pulsarKeys.all }),
      ]),
  });
}

import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ToaExclusion } from '../../../../api/contracts/toas';
import { api } from '../../../lib/api-client';

export const exclusionKeys = {
  all: ['exclusions'] as const,
  ofPulsar: (pulsarId: string) => ['exclusions', 'pulsar', pulsarId] as const,
};

/** GET /api/pulsars/:id/exclusions: the whole history; an entry with `restoredAt` null is in force. */
export const getExclusions = (pulsarId: string) => api.get<ToaExclusion[]>(`/pulsars/${encodeURIComponent(pulsarId)}/exclusions`);

export const exclusionsQueryOptions = (pulsarId: string) =>
  queryOptions({ queryKey: exclusionKeys.ofPulsar(pulsarId), queryFn: () => getExclusions(pulsarId) });

export const useExclusions = (pulsarId: string) => useQuery(exclusionsQueryOptions(pulsarId));

/** The ids of the TOAs excluded now (an exclusion not restored). */
export function activeExcludedToaIds(history: readonly ToaExclusion[]): Set<number> {
  const ids = new Set<number>();
  for (const entry of history) if (entry.restoredAt === null) ids.add(entry.toaId);
  return ids;
}

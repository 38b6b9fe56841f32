import { queryOptions, useQuery } from '@tanstack/react-query';
import type { TOABatch } from '../../../../api/contracts/toas';
import { api } from '../../../lib/api-client';

/** One stored upload, as the API's shared contract names it (api/contracts/toas.ts). */
export type ToaBatch = TOABatch;

export const toaBatchKeys = {
  all: ['toa-batches'] as const,
  ofPulsar: (pulsarId: string) => ['toa-batches', 'pulsar', pulsarId] as const,
};

export const getToaBatches = (pulsarId: string) => api.get<ToaBatch[]>(`/pulsars/${encodeURIComponent(pulsarId)}/toa-batches`);

export const toaBatchesQueryOptions = (pulsarId: string) =>
  queryOptions({ queryKey: toaBatchKeys.ofPulsar(pulsarId), queryFn: () => getToaBatches(pulsarId) });

export const useToaBatches = (pulsarId: string) => useQuery(toaBatchesQueryOptions(pulsarId));

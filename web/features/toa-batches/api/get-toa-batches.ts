import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

/** One stored upload (docs/api-workflow.md, "TOA batches and TOAs"). */
export interface ToaBatch {
  id: number;
  pulsarId: number;
  fileName: string;
  uploadedBy: { id: number; displayName: string };
  checksumSha256: string;
  rowCount: number;
  firstMjd: string;
  lastMjd: string;
  observatories: string[];
  backends: string[];
  status: 'stored';
  createdAt: string;
}

export const toaBatchKeys = {
  all: ['toa-batches'] as const,
  ofPulsar: (pulsarId: string) => ['toa-batches', 'pulsar', pulsarId] as const,
};

export const getToaBatches = (pulsarId: string) => api.get<ToaBatch[]>(`/pulsars/${encodeURIComponent(pulsarId)}/toa-batches`);

export const toaBatchesQueryOptions = (pulsarId: string) =>
  queryOptions({ queryKey: toaBatchKeys.ofPulsar(pulsarId), queryFn: () => getToaBatches(pulsarId) });

export const useToaBatches = (pulsarId: string) => useQuery(toaBatchesQueryOptions(pulsarId));

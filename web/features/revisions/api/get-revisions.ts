import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

/** One saved model revision, without its model (docs/api-workflow.md, "Model revisions"). */
export interface Revision {
  id: number;
  pulsarId: number;
  parentId: number | null;
  /** null once the author's account is deleted. */
  author: { id: number; displayName: string } | null;
  message: string;
  createdAt: string;
  releasedAt: string | null;
  releasedBy: { id: number; displayName: string } | null;
  releaseNote: string | null;
}

export const revisionKeys = {
  all: ['revisions'] as const,
  ofPulsar: (pulsarId: string) => ['revisions', 'pulsar', pulsarId] as const,
  detail: (revisionId: number) => ['revisions', 'detail', revisionId] as const,
};

/** Newest first. */
export const getRevisions = (pulsarId: string) => api.get<Revision[]>(`/pulsars/${encodeURIComponent(pulsarId)}/revisions`);

export const revisionsQueryOptions = (pulsarId: string) =>
  queryOptions({ queryKey: revisionKeys.ofPulsar(pulsarId), queryFn: () => getRevisions(pulsarId) });

export const useRevisions = (pulsarId: string) => useQuery(revisionsQueryOptions(pulsarId));

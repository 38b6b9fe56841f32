import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

/** One saved model revision (docs/api-workflow.md, "Model revisions"). */
export interface ModelRevision {
  id: number;
  pulsarId: number;
  parentId: number | null;
  author: { id: number | string; displayName: string };
  message: string;
  createdAt: string;
  releasedAt: string | null;
  releaseNote: string | null;
}
export type ModelRevisionWithModel = ModelRevision & { model: unknown };

// The same keys as the pulsar page's revision timeline: one endpoint, one cache entry.
export const modelRevisionKeys = {
  all: ['revisions'] as const,
  ofPulsar: (pulsarId: string) => ['revisions', 'pulsar', pulsarId] as const,
  detail: (revisionId: number) => ['revisions', 'detail', revisionId] as const,
};

/** GET /api/pulsars/:id/revisions, newest first. */
export const getModelRevisions = (pulsarId: string) => api.get<ModelRevision[]>(`/pulsars/${encodeURIComponent(pulsarId)}/revisions`);

export const modelRevisionsQueryOptions = (pulsarId: string) =>
  queryOptions({ queryKey: modelRevisionKeys.ofPulsar(pulsarId), queryFn: () => getModelRevisions(pulsarId) });

export const useModelRevisions = (pulsarId: string) => useQuery(modelRevisionsQueryOptions(pulsarId));

/** GET /api/revisions/:id, with its model. */
export const getModelRevision = (revisionId: number) => api.get<ModelRevisionWithModel>(`/revisions/${encodeURIComponent(String(revisionId))}`);

// Saved revisions never change, so the model is fetched once.
export const modelRevisionQueryOptions = (revisionId: number) =>
  queryOptions({ queryKey: modelRevisionKeys.detail(revisionId), queryFn: () => getModelRevision(revisionId), staleTime: Infinity });

export const useModelRevision = (revisionId: number | null) =>
  useQuery({ ...modelRevisionQueryOptions(revisionId ?? 0), enabled: revisionId !== null });

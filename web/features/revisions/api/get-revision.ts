import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { revisionKeys, type Revision } from './get-revisions';

export type RevisionWithModel = Revision & { model: unknown };

export const getRevision = (revisionId: number) => api.get<RevisionWithModel>(`/revisions/${encodeURIComponent(String(revisionId))}`);

// Revisions are immutable once saved, so a fetched model never goes stale.
export const revisionQueryOptions = (revisionId: number) =>
  queryOptions({ queryKey: revisionKeys.detail(revisionId), queryFn: () => getRevision(revisionId), staleTime: Infinity });

export const useRevision = (revisionId: number | null) =>
  useQuery({ ...revisionQueryOptions(revisionId ?? 0), enabled: revisionId !== null });

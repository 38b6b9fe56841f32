import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { RevisionWithModel } from '../../revisions/api/get-revision';
import { revisionKeys } from '../../revisions/api/get-revisions';

export interface CreateModelRevisionBody {
  model: unknown;
  message: string;
  parentId?: number;
}

/** POST /api/pulsars/:id/revisions → 201 the new revision with its model; 400 `validation_failed` names model paths. */
export const createModelRevision = (pulsarId: string, body: CreateModelRevisionBody) =>
  api.post<RevisionWithModel>(`/pulsars/${encodeURIComponent(pulsarId)}/revisions`, body);

export function useCreateModelRevision(pulsarId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateModelRevisionBody) => createModelRevision(pulsarId, body),
    onSuccess: (revision) => {
      queryClient.setQueryData(revisionKeys.detail(revision.id), revision);
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: revisionKeys.ofPulsar(pulsarId) }),
        queryClient.invalidateQueries({ queryKey: ['pulsars'] }), // the revision count on pulsar lists
      ]);
    },
  });
}

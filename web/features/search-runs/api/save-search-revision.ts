import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { SaveSearchRevisionBody } from '../../../../api/contracts/search-runs';
import type { RevisionWithModel } from '../../revisions/api/get-revision';
import { revisionKeys } from '../../revisions/api/get-revisions';
import { searchRunKeys } from './get-search-run';

/**
 * POST /api/search-runs/:id/save-revision {message} → 201 the new revision with its model;
 * 409 `conflict` when the run has not succeeded, was saved already or found no companion.
 */
export const saveSearchRevision = (searchRunId: string, body: SaveSearchRevisionBody) =>
  api.post<RevisionWithModel>(`/search-runs/${encodeURIComponent(searchRunId)}/save-revision`, body);

export function useSaveSearchRevision(searchRunId: string, pulsarId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: SaveSearchRevisionBody) => saveSearchRevision(searchRunId, body),
    onSuccess: (revision) => {
      queryClient.setQueryData(revisionKeys.detail(revision.id), revision);
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: searchRunKeys.all }), // savedRevisionId
        queryClient.invalidateQueries({ queryKey: revisionKeys.ofPulsar(pulsarId) }),
        queryClient.invalidateQueries({ queryKey: ['pulsars'] }), // the revision count on pulsar lists
      ]);
    },
  });
}

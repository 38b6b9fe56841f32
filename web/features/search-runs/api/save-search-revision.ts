import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { SaveSearchRevisionBody } from '../../../../api/contracts/search-runs';
import { revisionKeys } from '../../revisions/api/get-revisions';
import { searchRunKeys, type SearchRun } from './get-search-run';

/**
 * What POST /api/search-runs/:id/save-revision answers. The contract fixes the body but not the
 * answer, so the client accepts the three shapes a route may send: the new revision itself,
 * `{ revision, … }`, or the updated run (its `savedRevisionId`).
 */
export type SaveSearchRevisionAnswer =
  | { id: number; pulsarId: number }
  | { revision: { id: number } }
  | Pick<SearchRun, 'savedRevisionId'>;

/** The id of the saved revision in any of the accepted answers; null when none carries one. */
export function savedRevisionIdOf(answer: unknown): number | null {
  if (typeof answer !== 'object' || answer === null) return null;
  const a = answer as { id?: unknown; pulsarId?: unknown; revision?: { id?: unknown } | null; savedRevisionId?: unknown };
  if (typeof a.savedRevisionId === 'number') return a.savedRevisionId;
  if (a.revision && typeof a.revision.id === 'number') return a.revision.id;
  if (typeof a.id === 'number' && typeof a.pulsarId === 'number') return a.id;
  return null;
}

/** POST /api/search-runs/:id/save-revision {message} → the run's resulting model saved as a new revision. */
export const saveSearchRevision = (searchRunId: string, body: SaveSearchRevisionBody) =>
  api.post<SaveSearchRevisionAnswer>(`/search-runs/${encodeURIComponent(searchRunId)}/save-revision`, body);

export function useSaveSearchRevision(searchRunId: string, pulsarId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: SaveSearchRevisionBody) => saveSearchRevision(searchRunId, body),
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: searchRunKeys.all }),
        queryClient.invalidateQueries({ queryKey: revisionKeys.ofPulsar(pulsarId) }),
        queryClient.invalidateQueries({ queryKey: ['pulsars'] }), // the revision count on pulsar lists
      ]),
  });
}

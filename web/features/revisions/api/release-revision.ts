import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { comparisonKeys } from '../../fit-comparison/api/get-fit-comparison';
import { revisionKeys, type Revision } from './get-revisions';

/** docs/api-workflow.md, "Model revisions": the release note is 1–500 characters. */
export const MAX_RELEASE_NOTE_LENGTH = 500;

/** POST /api/revisions/:id/release (lead and admin): 409 when it is already released. */
export const releaseRevision = (revisionId: number, note: string) =>
  api.post<Revision>(`/revisions/${encodeURIComponent(String(revisionId))}/release`, { note });

/** POST /api/revisions/:id/withdraw-release (lead and admin): the revision itself stays as it was. */
export const withdrawRevisionRelease = (revisionId: number) =>
  api.post<Revision>(`/revisions/${encodeURIComponent(String(revisionId))}/withdraw-release`);

/** Both change what every revision list, revision detail and comparison shows as released. */
function useInvalidateReleases() {
  const queryClient = useQueryClient();
  return () =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: revisionKeys.all }),
      queryClient.invalidateQueries({ queryKey: comparisonKeys.all }),
    ]);
}

export function useReleaseRevision() {
  const invalidate = useInvalidateReleases();
  return useMutation({ mutationFn: ({ revisionId, note }: { revisionId: number; note: string }) => releaseRevision(revisionId, note), onSuccess: invalidate });
}

export function useWithdrawRevisionRelease() {
  const invalidate = useInvalidateReleases();
  return useMutation({ mutationFn: (revisionId: number) => withdrawRevisionRelease(revisionId), onSuccess: invalidate });
}

import { formatDateTimeUtc } from '../../../lib/format';
import { useRevision } from '../api/get-revision';
import { ReleasedBadge } from './released-badge';

/**
 * The released badge of one revision (fetched by id), with who released it, when, and the note as
 * its hover text. Shows nothing while loading, on error, or when the revision is not released: the
 * page around it carries on without it.
 */
export function RevisionReleaseMark({ revisionId }: { revisionId: number }) {
  const revision = useRevision(revisionId);
  const r = revision.data;
  if (!r?.releasedAt) return null;
  const title = `Released ${formatDateTimeUtc(r.releasedAt)}${r.releasedBy ? ` by ${r.releasedBy.displayName}` : ''}${r.releaseNote ? `: “${r.releaseNote}”` : ''}`;
  return <ReleasedBadge title={title} />;
}

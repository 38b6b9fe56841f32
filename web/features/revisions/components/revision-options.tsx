import type { Revision } from '../api/get-revisions';

/** The `<option>`s of a revision picker, newest first: id, message, and whether it is the latest or released. */
export function RevisionOptions({ revisions }: { revisions: readonly Revision[] }) {
  return (
    <>
      {revisions.map((r, i) => (
        <option key={r.id} value={String(r.id)}>
          #{r.id} — {r.message}
          {i === 0 ? ' (latest)' : ''}
          {r.releasedAt ? ' [released]' : ''}
        </option>
      ))}
    </>
  );
}

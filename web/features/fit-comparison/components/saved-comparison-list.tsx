import type { SavedComparison } from '../../../../api/contracts/comparisons';
import { TextLink } from '../../../components/text-link';
import { paths } from '../../../config/paths';
import { formatDateTimeUtc } from '../../../lib/format';

/** Saved comparisons, newest first: the comment, the runs (reference first), who and when, a link. */
export function SavedComparisonList({ comparisons }: { comparisons: SavedComparison[] }) {
  return (
    <ul aria-label="Saved comparisons" className="flex flex-col divide-y divide-night-800">
      {comparisons.map((c) => (
        <li key={c.id} className="py-2">
          <div className="flex flex-wrap items-baseline gap-x-3">
            <TextLink to={paths.savedComparison.href(c.id)}>Comparison #{c.id}</TextLink>
            <span className="text-xs text-night-300">
              runs {c.fitRunIds.map((id) => `#${id}`).join(', ')} (reference #{c.fitRunIds[0]})
            </span>
          </div>
          <p className="mt-0.5 text-sm text-night-100">{c.comment}</p>
          <p className="text-xs text-night-400">
            {c.createdBy?.displayName ?? 'a deleted account'} · {formatDateTimeUtc(c.createdAt)}
          </p>
        </li>
      ))}
    </ul>
  );
}

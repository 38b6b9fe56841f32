import { cn } from '../../../lib/cn';
import { formatDateTimeUtc } from '../../../lib/format';
import type { Revision } from '../api/get-revisions';
import { ReleaseControls, ReleaseDetails } from './release-controls';
import { ReleasedBadge } from './released-badge';

/**
 * The model's history, newest at the top, on a vertical line. Each entry has a "Compare" checkbox;
 * at most two are ticked at a time (ticking a third drops the oldest choice). Released entries carry
 * the released badge and the note; `canRelease` (models:release) adds release / withdraw controls.
 */
export function RevisionTimeline({
  revisions,
  selectedIds,
  onSelectedIdsChange,
  canRelease = false,
}: {
  revisions: Revision[];
  selectedIds: number[];
  onSelectedIdsChange: (ids: number[]) => void;
  canRelease?: boolean;
}) {
  const toggle = (id: number) => {
    if (selectedIds.includes(id)) onSelectedIdsChange(selectedIds.filter((s) => s !== id));
    else onSelectedIdsChange([...selectedIds, id].slice(-2));
  };
  return (
    <ol aria-label="Model revisions" className="relative ml-2 border-l border-night-700">
      {revisions.map((r, i) => {
        const selected = selectedIds.includes(r.id);
        return (
          <li key={r.id} className="relative pb-5 pl-6 last:pb-0">
            <span
              aria-hidden="true"
              className={cn(
                'absolute -left-[7px] top-1.5 size-3 rounded-full border-2',
                r.releasedAt ? 'border-calm-400 bg-calm-500' : i === 0 ? 'border-ember-400 bg-ember-500' : 'border-night-500 bg-night-800',
              )}
            />
            <div className={cn('rounded-md px-3 py-2', selected && 'bg-night-800 ring-1 ring-ember-500/50')}>
              <div className="flex flex-wrap items-center gap-2">
                <span className="font-mono text-xs text-night-400">#{r.id}</span>
                <p className="font-medium text-night-100">{r.message}</p>
                {i === 0 ? <span className="rounded-full border border-ember-500/60 px-2 text-xs text-ember-300">latest</span> : null}
                {r.releasedAt ? <ReleasedBadge title={r.releaseNote ?? undefined} /> : null}
              </div>
              <p className="mt-0.5 text-xs text-night-300">
                {r.author?.displayName ?? 'unknown author'} · {formatDateTimeUtc(r.createdAt)}
                {r.parentId !== null ? ` · from #${r.parentId}` : ''}
              </p>
              <ReleaseDetails revision={r} />
              <label className="mt-1 inline-flex items-center gap-2 text-xs text-night-300">
                <input type="checkbox" checked={selected} onChange={() => toggle(r.id)} className="accent-ember-500" />
                Compare #{r.id}
              </label>
              {canRelease ? <ReleaseControls revision={r} /> : null}
            </div>
          </li>
        );
      })}
    </ol>
  );
}

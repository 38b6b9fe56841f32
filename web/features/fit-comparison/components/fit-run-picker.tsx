import { useState } from 'react';
import { Link } from 'react-router-dom';
import { MAX_COMPARED_RUNS, MIN_COMPARED_RUNS } from '../../../../api/contracts/comparisons';
import { EmptyState } from '../../../components/empty-state';
import { paths } from '../../../config/paths';
import { cn } from '../../../lib/cn';
import { formatDateTimeUtc } from '../../../lib/format';
import type { FitRunSummary } from '../../fit-runs/api/get-fit-run';
import { formatReducedChi2, formatRmsUs } from '../../fit-runs/lib/format-fit';
import type { Revision } from '../../revisions/api/get-revisions';
import { ReleasedBadge } from '../../revisions/components/released-badge';

const linkClasses =
  'inline-flex h-9 items-center rounded-md bg-ember-500 px-4 text-sm font-medium text-night-950 hover:bg-ember-400 focus-ring';

/**
 * Tick 2–4 finished fit runs of the pulsar; the first ticked is the reference. Opens the comparison
 * page with them. Runs that did not succeed have no results to compare and are not offered.
 */
export function FitRunPicker({ pulsarId, runs, revisions }: { pulsarId: string; runs: FitRunSummary[]; revisions: Revision[] }) {
  const [chosen, setChosen] = useState<number[]>([]);
  const finished = runs.filter((r) => r.status === 'succeeded');
  if (finished.length < MIN_COMPARED_RUNS) {
    return (
      <EmptyState title="Two finished fits are needed to compare">
        {finished.length === 0 ? 'No fit has finished yet. ' : 'One fit has finished. '}
        Queue a fit of another revision (for example one that frees more parameters) in “Fit runs”, then come back here.
      </EmptyState>
    );
  }
  const byId = new Map(revisions.map((r, i) => [r.id, { revision: r, number: revisions.length - i }])); // newest first → 1-based oldest first
  const full = chosen.length >= MAX_COMPARED_RUNS;
  const toggle = (id: number) => setChosen((c) => (c.includes(id) ? c.filter((x) => x !== id) : [...c, id]));
  return (
    <div className="flex flex-col gap-3">
      <p className="text-xs text-night-400">
        Tick {MIN_COMPARED_RUNS} to {MAX_COMPARED_RUNS} finished runs. The first one you tick is the reference the others are measured
        against.
      </p>
      <ul aria-label="Finished fit runs to compare" className="flex flex-col gap-1">
        {finished.map((run) => {
          const position = chosen.indexOf(run.id);
          const entry = byId.get(run.revisionId);
          const disabled = position < 0 && full;
          return (
            <li key={run.id}>
              <label
                className={cn(
                  'flex flex-wrap items-center gap-x-3 gap-y-1 rounded-md px-2 py-1.5 text-sm',
                  position >= 0 ? 'bg-night-800 ring-1 ring-ember-500/50' : 'hover:bg-night-800/50',
                  disabled && 'opacity-60',
                )}
              >
                <input type="checkbox" checked={position >= 0} disabled={disabled} onChange={() => toggle(run.id)} className="accent-ember-500" />
                <span className="font-medium text-night-100">Run #{run.id}</span>
                <span className="text-xs text-night-300">
                  revision {entry ? `${entry.number} (#${run.revisionId})` : `#${run.revisionId}`}
                  {entry ? ` · ${entry.revision.message}` : ''}
                </span>
                {entry?.revision.releasedAt ? <ReleasedBadge /> : null}
                <span className="font-mono text-xs text-night-300">
                  χ²/dof {formatReducedChi2(run.result?.reducedChi2)} · {formatRmsUs(run.result?.weightedRmsUs)}
                </span>
                {run.finishedAt ? <span className="text-xs text-night-400">{formatDateTimeUtc(run.finishedAt)}</span> : null}
                {position === 0 ? <span className="rounded-full border border-night-400 px-2 text-xs text-night-100">reference</span> : null}
                {position > 0 ? <span className="text-xs text-night-300">compared #{position + 1}</span> : null}
              </label>
            </li>
          );
        })}
      </ul>
      {full ? <p className="text-xs text-night-400">At most {MAX_COMPARED_RUNS} runs at a time; untick one to choose another.</p> : null}
      <div>
        {chosen.length >= MIN_COMPARED_RUNS ? (
          <Link to={paths.fitComparison.href(pulsarId, chosen)} className={linkClasses}>
            Compare {chosen.length} runs
          </Link>
        ) : (
          <p className="text-sm text-night-300">
            {chosen.length === 0 ? 'Tick at least two runs to compare them.' : 'Tick one more run to compare.'}
          </p>
        )}
      </div>
    </div>
  );
}

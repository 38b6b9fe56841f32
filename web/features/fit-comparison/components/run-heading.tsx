import type { ComparedRun } from '../../../../api/contracts/comparisons';
import { TextLink } from '../../../components/text-link';
import { paths } from '../../../config/paths';
import { ReleasedBadge } from '../../revisions/components/released-badge';

/** The column heading of one compared run: link, revision, reference / released marks. */
export function RunHeading({ run, isReference }: { run: ComparedRun; isReference: boolean }) {
  return (
    <div className="flex min-w-40 flex-col items-start gap-1 normal-case tracking-normal">
      <TextLink to={paths.fitRun.href(String(run.fitRunId))} className="font-semibold">
        Run #{run.fitRunId}
      </TextLink>
      <span className="text-xs font-normal text-night-300" title={run.revision.message}>
        revision {run.revision.number} (#{run.revision.id}) · {run.revision.message}
      </span>
      <span className="flex flex-wrap gap-1">
        {isReference ? (
          <span className="rounded-full border border-night-400 px-2 text-xs font-medium text-night-100">reference</span>
        ) : null}
        {run.revision.released ? <ReleasedBadge /> : null}
      </span>
    </div>
  );
}

import { FitStatusBadge } from '../../fit-runs/components/fit-status-badge';
import type { SearchRunStatus } from '../api/get-search-run';

/** A search's status in the same outlined word as a fit's (the two jobs share their five states). */
export function SearchStatusBadge({ status }: { status: SearchRunStatus }) {
  return <FitStatusBadge status={status} />;
}

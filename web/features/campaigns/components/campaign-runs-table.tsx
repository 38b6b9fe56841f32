import { createColumnHelper, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { DataTable } from '../../../components/data-table';
import { TextLink } from '../../../components/text-link';
import { paths } from '../../../config/paths';
import type { Campaign } from '../api/get-campaigns';
import { StatusBadge } from './campaign-status';

type Run = Campaign['runs'][number];
const column = createColumnHelper<Run>();
const columns = [
  column.accessor('pulsarName', {
    header: 'Pulsar',
    cell: (info) => <TextLink to={paths.pulsar.href(String(info.row.original.pulsarId))}>{info.getValue()}</TextLink>,
  }),
  column.accessor('revisionId', { header: 'Revision', cell: (info) => <span className="font-mono">{info.getValue() === null ? '—' : `#${info.getValue()}`}</span> }),
  column.accessor('status', { header: 'Status', cell: (info) => <StatusBadge status={info.getValue()} /> }),
  column.display({
    id: 'fitRun',
    header: 'Fit run',
    cell: ({ row }) =>
      row.original.fitRunId !== null ? (
        <TextLink to={paths.fitRun.href(String(row.original.fitRunId))}>Fit run #{row.original.fitRunId}</TextLink>
      ) : (
        <span className="text-night-400">{row.original.skippedReason ?? 'not queued yet'}</span>
      ),
  }),
];

/** The fit each pulsar of a campaign got, with a link to follow it. */
export function CampaignRunsTable({ runs }: { runs: Run[] }) {
  const table = useReactTable({ data: runs, columns, getCoreRowModel: getCoreRowModel(), getRowId: (r) => String(r.pulsarId) });
  return (
    <DataTable table={table} aria-label="Runs per pulsar" />
  );
}

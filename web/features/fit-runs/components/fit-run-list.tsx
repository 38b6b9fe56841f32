import { createColumnHelper, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { DataTable } from '../../../components/data-table';
import { TextLink } from '../../../components/text-link';
import { paths } from '../../../config/paths';
import { formatDateTimeUtc } from '../../../lib/format';
import { isFinalFitStatus, type FitRunSummary } from '../api/get-fit-run';
import { formatReducedChi2, formatRmsUs } from '../lib/format-fit';
import { FitProgress } from './fit-progress';
import { FitStatusBadge } from './fit-status-badge';

const column = createColumnHelper<FitRunSummary>();
const columns = [
  column.accessor('id', {
    header: 'Run',
    cell: (i) => <TextLink to={paths.fitRun.href(String(i.getValue()))}>Run #{i.getValue()}</TextLink>,
  }),
  column.accessor('revisionId', { header: 'Revision', cell: (i) => <span className="font-mono">#{i.getValue()}</span> }),
  column.accessor('status', {
    header: 'Status',
    cell: ({ row }) => {
      const run = row.original;
      if (isFinalFitStatus(run.status)) return <FitStatusBadge status={run.status} />;
      return (
        <FitProgress
          percent={run.progress?.percent ?? 0}
          stage={run.progress?.stage ?? run.status}
          label={`Progress of run #${run.id}`}
        />
      );
    },
  }),
  column.accessor((r) => r.result?.reducedChi2 ?? null, {
    id: 'reducedChi2',
    header: () => (
      <span className="whitespace-nowrap">
        Reduced <span className="normal-case">χ²</span>
      </span>
    ),
    cell: (i) => <span className="font-mono tabular-nums">{formatReducedChi2(i.getValue())}</span>,
  }),
  column.accessor((r) => r.result?.weightedRmsUs ?? null, {
    id: 'rms',
    header: 'Weighted RMS',
    cell: (i) => <span className="font-mono tabular-nums">{formatRmsUs(i.getValue())}</span>,
  }),
  column.accessor((r) => r.finishedAt ?? r.queuedAt, {
    id: 'when',
    header: 'When',
    cell: ({ row }) =>
      row.original.finishedAt ? `finished ${formatDateTimeUtc(row.original.finishedAt)}` : `queued ${formatDateTimeUtc(row.original.queuedAt)}`,
  }),
];

/** A pulsar's fit runs, newest first as the API sends them; unfinished runs show their progress. */
export function FitRunList({ runs }: { runs: FitRunSummary[] }) {
  const table = useReactTable({ data: runs, columns, getCoreRowModel: getCoreRowModel(), getRowId: (r) => String(r.id) });
  return (
    <DataTable table={table} aria-label="Fit runs" />
  );
}

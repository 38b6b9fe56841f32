import { createColumnHelper, flexRender, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { Table, TBody, Td, Th, THead, Tr } from '../../../components/table';
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
    <Table aria-label="Fit runs">
      <THead>
        {table.getHeaderGroups().map((group) => (
          <tr key={group.id}>
            {group.headers.map((h) => (
              <Th key={h.id}>{flexRender(h.column.columnDef.header, h.getContext())}</Th>
            ))}
          </tr>
        ))}
      </THead>
      <TBody>
        {table.getRowModel().rows.map((row) => (
          <Tr key={row.id}>
            {row.getVisibleCells().map((cell) => (
              <Td key={cell.id}>{flexRender(cell.column.columnDef.cell, cell.getContext())}</Td>
            ))}
          </Tr>
        ))}
      </TBody>
    </Table>
  );
}

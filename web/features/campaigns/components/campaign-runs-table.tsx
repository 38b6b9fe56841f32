import { createColumnHelper, flexRender, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { Table, TBody, Td, Th, THead, Tr } from '../../../components/table';
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
    <Table aria-label="Runs per pulsar">
      <THead>
        {table.getHeaderGroups().map((group) => (
          <tr key={group.id}>
            {group.headers.map((header) => (
              <Th key={header.id}>{flexRender(header.column.columnDef.header, header.getContext())}</Th>
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

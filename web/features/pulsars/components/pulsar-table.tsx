import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  getSortedRowModel,
  useReactTable,
  type SortingState,
} from '@tanstack/react-table';
import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Table, TBody, Td, Th, THead, Tr } from '../../../components/table';
import { paths } from '../../../config/paths';
import { formatCount, formatMjd } from '../../../lib/format';
import type { Pulsar } from '../api/get-pulsars';

const column = createColumnHelper<Pulsar>();
const columns = [
  column.accessor('name', {
    header: 'Name',
    cell: (info) => (
      <Link to={paths.pulsar.href(String(info.row.original.id))} className="rounded-sm font-medium text-ember-300 hover:underline">
        {info.getValue()}
      </Link>
    ),
  }),
  column.accessor('raHms', { header: 'Right ascension', enableSorting: false, cell: (i) => <span className="font-mono">{i.getValue()}</span> }),
  column.accessor('decDms', { header: 'Declination', enableSorting: false, cell: (i) => <span className="font-mono">{i.getValue()}</span> }),
  column.accessor('toaCount', {
    header: 'TOAs',
    sortDescFirst: true,
    cell: (i) => <span className="font-mono tabular-nums">{formatCount(i.getValue())}</span>,
  }),
  column.display({
    id: 'span',
    header: 'Span (MJD)',
    cell: ({ row }) => (
      <span className="font-mono text-night-200">
        {row.original.firstMjd === null ? '—' : `${formatMjd(row.original.firstMjd)} – ${formatMjd(row.original.lastMjd)}`}
      </span>
    ),
  }),
  column.accessor((p) => p.observatories.join(', '), { id: 'observatories', header: 'Observatories', enableSorting: false }),
];

function sortLabel(direction: false | 'asc' | 'desc'): 'ascending' | 'descending' | 'none' {
  return direction === 'asc' ? 'ascending' : direction === 'desc' ? 'descending' : 'none';
}

/** All pulsars; the Name and TOAs headers are buttons that sort the rows. */
export function PulsarTable({ pulsars }: { pulsars: Pulsar[] }) {
  const [sorting, setSorting] = useState<SortingState>([{ id: 'name', desc: false }]);
  const table = useReactTable({
    data: pulsars,
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
  });

  return (
    <Table aria-label="Pulsars">
      <THead>
        {table.getHeaderGroups().map((group) => (
          <tr key={group.id}>
            {group.headers.map((header) => {
              const sorted = header.column.getIsSorted();
              const label = flexRender(header.column.columnDef.header, header.getContext());
              return (
                <Th key={header.id} aria-sort={header.column.getCanSort() ? sortLabel(sorted) : undefined}>
                  {header.column.getCanSort() ? (
                    <button
                      type="button"
                      onClick={header.column.getToggleSortingHandler()}
                      className="inline-flex items-center gap-1 rounded-sm uppercase tracking-wide hover:text-night-100"
                    >
                      {label}
                      <span aria-hidden="true" className="text-ember-400">
                        {sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '·'}
                      </span>
                    </button>
                  ) : (
                    label
                  )}
                </Th>
              );
            })}
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

import {
  createColumnHelper,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type FilterFn,
  type SortingState,
} from '@tanstack/react-table';
import { useState } from 'react';
import { Link } from 'react-router-dom';
import { DataTable } from '../../../components/data-table';
import { Input } from '../../../components/input';
import { paths } from '../../../config/paths';
import { formatCount, formatDateTimeUtc, formatMjd } from '../../../lib/format';
import type { Pulsar } from '../api/get-pulsars';
import { PULSAR_STATUS_LABELS, pulsarStatus } from '../lib/pulsar-status';

const fixed3 = (v: number | null | undefined) => (typeof v === 'number' && Number.isFinite(v) ? v.toPrecision(3) : '—');

/** Sorts MJD decimal strings by value without a float (integer day first, then the fraction as text). */
function compareMjd(a: string | number | null | undefined, b: string | number | null | undefined): number {
  if (a === null || a === undefined) return b === null || b === undefined ? 0 : 1;
  if (b === null || b === undefined) return -1;
  const [da, fa = ''] = String(a).split('.');
  const [db, fb = ''] = String(b).split('.');
  const dayDiff = Number(da) - Number(db);
  if (dayDiff !== 0) return dayDiff;
  const width = Math.max(fa.length, fb.length);
  return fa.padEnd(width, '0').localeCompare(fb.padEnd(width, '0'));
}

/** The text filter matches the name, observatories and status words, ignoring case. */
const matchesText: FilterFn<Pulsar> = (row, _columnId, value: string) => {
  const needle = value.trim().toLowerCase();
  if (needle === '') return true;
  const p = row.original;
  const haystack = [p.name, ...p.observatories, PULSAR_STATUS_LABELS[pulsarStatus(p)]].join(' ').toLowerCase();
  return haystack.includes(needle);
};

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
  column.accessor('toaCount', {
    header: 'TOAs',
    sortDescFirst: true,
    cell: (i) => <span className="font-mono tabular-nums">{formatCount(i.getValue())}</span>,
  }),
  column.accessor('firstMjd', {
    id: 'span',
    header: 'Span (MJD)',
    sortingFn: (a, b) => compareMjd(a.original.firstMjd, b.original.firstMjd),
    sortDescFirst: false,
    sortUndefined: 'last',
    cell: ({ row }) => (
      <span className="whitespace-nowrap font-mono text-night-200">
        {row.original.firstMjd === null ? '—' : `${formatMjd(row.original.firstMjd)} – ${formatMjd(row.original.lastMjd)}`}
      </span>
    ),
  }),
  column.accessor((p) => p.observatories.join(', '), { id: 'observatories', header: 'Observatories', enableSorting: false }),
  column.accessor((p) => p.latestFit?.reducedChi2 ?? undefined, {
    id: 'reducedChi2',
    header: () => (
      <span className="whitespace-nowrap">
        Reduced <span className="normal-case">χ²</span>
      </span>
    ),
    sortUndefined: 'last',
    sortDescFirst: false, // best-fitting first
    cell: (i) => <span className="font-mono tabular-nums">{fixed3(i.getValue())}</span>,
  }),
  column.accessor((p) => p.latestFit?.weightedRmsUs ?? undefined, {
    id: 'rms',
    header: () => (
      <span className="whitespace-nowrap">
        RMS (<span className="normal-case">µs</span>)
      </span>
    ),
    sortUndefined: 'last',
    sortDescFirst: false,
    cell: (i) => <span className="font-mono tabular-nums">{fixed3(i.getValue())}</span>,
  }),
  column.accessor((p) => p.latestFit?.finishedAt ?? undefined, {
    id: 'fitted',
    header: 'Last fit',
    sortUndefined: 'last',
    sortDescFirst: true,
    cell: (i) => {
      const when = i.getValue();
      return <span className="text-night-200">{when ? formatDateTimeUtc(when) : '—'}</span>;
    },
  }),
  column.accessor((p) => PULSAR_STATUS_LABELS[pulsarStatus(p)], { id: 'status', header: 'Status' }),
];

/** All pulsars with their TOAs and latest fit; headers sort, the text box filters. */
export function PulsarTable({ pulsars }: { pulsars: Pulsar[] }) {
  const [sorting, setSorting] = useState<SortingState>([{ id: 'name', desc: false }]);
  const [filter, setFilter] = useState('');
  const table = useReactTable({
    data: pulsars,
    columns,
    state: { sorting, globalFilter: filter },
    onSortingChange: setSorting,
    onGlobalFilterChange: setFilter,
    globalFilterFn: matchesText,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
  });
  const shown = table.getRowModel().rows;

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <label className="flex items-center gap-2 text-sm text-night-200">
          <span>Filter</span>
          <Input
            type="search"
            value={filter}
            onChange={(e) => setFilter(e.target.value)}
            placeholder="name, observatory or status"
            className="h-9 w-64"
            aria-label="Filter pulsars"
          />
        </label>
        <p className="text-xs text-night-400" aria-live="polite">
          {shown.length === pulsars.length ? `${pulsars.length} pulsar${pulsars.length === 1 ? '' : 's'}` : `${shown.length} of ${pulsars.length} pulsars`}
        </p>
      </div>
      <DataTable table={table} aria-label="Pulsars" emptyMessage={<>No pulsar matches “{filter.trim()}”.</>} />
    </div>
  );
}

import { createColumnHelper, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { DataTable } from '../../../components/data-table';
import { TextLink } from '../../../components/text-link';
import { paths } from '../../../config/paths';
import { cn } from '../../../lib/cn';
import type { Campaign, FitFigures } from '../api/get-campaigns';
import { StatusBadge } from './campaign-status';

type Row = NonNullable<Campaign['summary']>[number];

const figure = (v: number | null | undefined) => (typeof v === 'number' && Number.isFinite(v) ? v.toPrecision(4) : '—');

/** "before → after" with the relative change; lower is shown as better, higher as worse. */
export function BeforeAfter({ before, after, unit }: { before: number | null | undefined; after: number | null | undefined; unit?: string }) {
  const hasBoth = typeof before === 'number' && typeof after === 'number' && Number.isFinite(before) && Number.isFinite(after);
  const changePercent = hasBoth && before !== 0 ? (100 * (after - before)) / Math.abs(before) : null;
  const direction = !hasBoth || after === before ? 'same' : after < before ? 'lower' : 'higher';
  return (
    <span className="font-mono tabular-nums">
      <span className="text-night-300">{figure(before)}</span>
      <span aria-hidden="true" className="mx-1.5 text-night-500">
        →
      </span>
      <span className="sr-only"> to </span>
      <span className={cn(direction === 'lower' && 'font-semibold text-calm-400', direction === 'higher' && 'font-semibold text-alarm-300')}>{figure(after)}</span>
      {unit ? <span className="ml-1 text-night-400">{unit}</span> : null}
      {changePercent !== null ? (
        <span data-change={direction} className={cn('ml-2 text-xs', direction === 'lower' ? 'text-calm-400' : direction === 'higher' ? 'text-alarm-300' : 'text-night-400')}>
          ({changePercent > 0 ? '+' : changePercent < 0 ? '−' : '±'}
          {Math.abs(changePercent).toFixed(1)}%)
        </span>
      ) : null}
    </span>
  );
}

const pick = (f: FitFigures | null, key: keyof FitFigures) => (f ? f[key] : null);

const column = createColumnHelper<Row>();
const columns = [
  column.accessor('pulsarName', {
    header: 'Pulsar',
    cell: (info) => <TextLink to={paths.pulsar.href(String(info.row.original.pulsarId))}>{info.getValue()}</TextLink>,
  }),
  column.display({
    id: 'chi2',
    header: 'Reduced χ² before → after',
    cell: ({ row }) => <BeforeAfter before={pick(row.original.before, 'reducedChi2')} after={pick(row.original.after, 'reducedChi2')} />,
  }),
  column.display({
    id: 'rms',
    header: 'Weighted RMS before → after',
    cell: ({ row }) => <BeforeAfter before={pick(row.original.before, 'weightedRmsUs')} after={pick(row.original.after, 'weightedRmsUs')} unit="µs" />,
  }),
  column.accessor('status', { header: 'Status', cell: (info) => <StatusBadge status={info.getValue()} /> }),
];

/** What the campaign changed, per pulsar: the previous fit's figures against the new fit's. */
export function CampaignSummaryTable({ rows }: { rows: Row[] }) {
  const table = useReactTable({ data: rows, columns, getCoreRowModel: getCoreRowModel(), getRowId: (r) => String(r.pulsarId) });
  return (
    <DataTable table={table} aria-label="What changed" />
  );
}

import { createColumnHelper, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { DataTable } from '../../../components/data-table';
import { StageProgressBar } from '../../../components/progress-bar';
import { TextLink } from '../../../components/text-link';
import { paths } from '../../../config/paths';
import { formatDateTimeUtc } from '../../../lib/format';
import { isFinalSearchStatus, type SearchRunSummary } from '../api/get-search-run';
import { formatFap } from '../lib/format-search';
import { SearchStatusBadge } from './search-status-badge';

function foundText(run: SearchRunSummary): string {
  if (!run.result) return '—';
  const n = run.result.companionsFound;
  const rejected = run.result.candidates.filter((c) => c.status !== 'accepted').length;
  return `${n} companion${n === 1 ? '' : 's'}${rejected > 0 ? `, ${rejected} rejected` : ''}`;
}

const column = createColumnHelper<SearchRunSummary>();
const columns = [
  column.accessor('id', { header: 'Search', cell: (i) => <TextLink to={paths.searchRun.href(i.getValue())}>Search #{i.getValue()}</TextLink> }),
  column.accessor('revisionId', { header: 'Revision', cell: (i) => <span className="font-mono">#{i.getValue()}</span> }),
  column.accessor('status', {
    header: 'Status',
    cell: ({ row }) => {
      const run = row.original;
      if (isFinalSearchStatus(run.status)) return <SearchStatusBadge status={run.status} />;
      return (
        <StageProgressBar className="min-w-40" label={`Progress of search #${run.id}`} percent={run.progress?.percent ?? 0} stage={run.progress?.stage ?? run.status} />
      );
    },
  }),
  column.display({ id: 'found', header: 'Found', cell: ({ row }) => foundText(row.original) }),
  column.accessor((r) => r.options.falseAlarmThreshold, {
    id: 'threshold',
    header: 'FAP threshold',
    cell: (i) => <span className="font-mono tabular-nums">{formatFap(i.getValue())}</span>,
  }),
  column.accessor((r) => r.finishedAt ?? r.queuedAt, {
    id: 'when',
    header: 'When',
    cell: ({ row }) =>
      row.original.finishedAt ? `finished ${formatDateTimeUtc(row.original.finishedAt)}` : `queued ${formatDateTimeUtc(row.original.queuedAt)}`,
  }),
];

/** A pulsar's companion searches, newest first as the API sends them; unfinished ones show their progress. */
export function SearchRunList({ runs }: { runs: SearchRunSummary[] }) {
  const table = useReactTable({ data: runs, columns, getCoreRowModel: getCoreRowModel(), getRowId: (r) => String(r.id) });
  return <DataTable table={table} aria-label="Companion searches" />;
}

import { createColumnHelper, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { useMemo } from 'react';
import { DataTable } from '../../../components/data-table';
import { ErrorPanel, LoadingPanel } from '../../../components/query-state';
import { cn } from '../../../lib/cn';
import { useRevision } from '../api/get-revision';
import { modelDiff, type ModelChange } from '../lib/model-diff';

const column = createColumnHelper<ModelChange>();
const columns = [
  column.accessor('path', { header: 'Path', cell: (i) => <span className="font-mono text-night-100">{i.getValue()}</span> }),
  column.display({
    id: 'change',
    header: 'Before → after',
    cell: ({ row }) => {
      const c = row.original;
      return (
        <span className="font-mono text-xs">
          <span className={cn(c.before === null ? 'text-night-500' : 'text-alarm-300')}>{c.before ?? '(absent)'}</span>
          <span aria-hidden="true" className="px-2 text-night-400">→</span>
          <span className="sr-only"> becomes </span>
          <span className={cn(c.after === null ? 'text-night-500' : 'text-calm-400')}>{c.after ?? '(absent)'}</span>
        </span>
      );
    },
  }),
];

function ChangeTable({ changes, label }: { changes: ModelChange[]; label: string }) {
  const table = useReactTable({ data: changes, columns, getCoreRowModel: getCoreRowModel() });
  return (
    <DataTable table={table} aria-label={label} />
  );
}

/** The changed paths between two revisions' models; `olderId` is shown as "before". */
export function RevisionDiff({ olderId, newerId }: { olderId: number; newerId: number }) {
  const older = useRevision(olderId);
  const newer = useRevision(newerId);
  const changes = useMemo(
    () => (older.data && newer.data ? modelDiff(older.data.model, newer.data.model) : null),
    [older.data, newer.data],
  );
  if (older.isError || newer.isError) return <ErrorPanel error={older.error ?? newer.error} title="Could not load the revisions" />;
  if (!changes) return <LoadingPanel label="Loading both models…" />;
  const label = `Changes from #${olderId} to #${newerId}`;
  return (
    <div>
      <h3 className="mb-2 text-sm font-semibold text-night-100">{label}</h3>
      {changes.length === 0 ? (
        <p className="text-sm text-night-300">The two models are identical.</p>
      ) : (
        <ChangeTable changes={changes} label={label} />
      )}
    </div>
  );
}

import { createColumnHelper, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { useMemo, useState } from 'react';
import { Alert } from '../../../components/alert';
import { Button } from '../../../components/button';
import { DataTable } from '../../../components/data-table';
import { describeError } from '../../../components/query-state';
import { formatCount, formatDateTimeUtc, formatMjd } from '../../../lib/format';
import { useDeleteToaBatch } from '../api/delete-toa-batch';
import type { ToaBatch } from '../api/get-toa-batches';
import { ConfirmDialog } from './confirm-dialog';

const column = createColumnHelper<ToaBatch>();
const baseColumns = [
  column.accessor('fileName', { header: 'File', cell: (i) => <span className="font-mono text-night-100">{i.getValue()}</span> }),
  column.accessor((b) => b.uploadedBy?.displayName ?? '—', { id: 'uploader', header: 'Uploaded by' }),
  column.accessor('rowCount', { header: 'TOAs', cell: (i) => <span className="font-mono tabular-nums">{formatCount(i.getValue())}</span> }),
  column.display({
    id: 'span',
    header: 'Span (MJD)',
    cell: ({ row }) => (
      <span className="font-mono text-night-200">
        {formatMjd(row.original.firstMjd)} – {formatMjd(row.original.lastMjd)}
      </span>
    ),
  }),
  column.accessor((b) => b.observatories.join(', '), { id: 'observatories', header: 'Observatories' }),
  column.accessor((b) => b.backends.join(', '), { id: 'backends', header: 'Backends' }),
  column.accessor('createdAt', { header: 'Uploaded', cell: (i) => formatDateTimeUtc(i.getValue()) }),
];

/**
 * A pulsar's uploads, newest first. With `canDelete`, each row has a Delete button that asks
 * for confirmation, naming how many TOAs go with the batch.
 */
export function ToaBatchTable({ batches, canDelete }: { batches: ToaBatch[]; canDelete: boolean }) {
  const [pending, setPending] = useState<ToaBatch | null>(null);
  const remove = useDeleteToaBatch();
  const columns = useMemo(
    () =>
      canDelete
        ? [
            ...baseColumns,
            column.display({
              id: 'actions',
              header: () => <span className="sr-only">Actions</span>,
              cell: ({ row }) => (
                <Button
                  variant="danger"
                  size="sm"
                  aria-label={`Delete ${row.original.fileName}`}
                  onClick={() => setPending(row.original)}
                >
                  Delete
                </Button>
              ),
            }),
          ]
        : baseColumns,
    [canDelete],
  );
  const table = useReactTable({ data: batches, columns, getCoreRowModel: getCoreRowModel(), getRowId: (b) => String(b.id) });

  return (
    <>
      {remove.isSuccess ? <Alert tone="success" className="mb-3">The batch and its TOAs were deleted.</Alert> : null}
      <DataTable table={table} aria-label="TOA batches" />
      {pending ? (
        <ConfirmDialog
          title={`Delete ${pending.fileName}?`}
          confirmLabel={`Delete ${formatCount(pending.rowCount)} TOAs`}
          busy={remove.isPending}
          onCancel={() => {
            remove.reset();
            setPending(null);
          }}
          onConfirm={() => remove.mutate(pending.id, { onSuccess: () => setPending(null) })}
        >
          <p>
            This removes the batch and its {formatCount(pending.rowCount)} TOA{pending.rowCount === 1 ? '' : 's'} (with any
            exclusions on them) for good.
          </p>
          {remove.isError ? (
            <Alert tone="error" className="mt-3">
              {describeError(remove.error)}
            </Alert>
          ) : null}
        </ConfirmDialog>
      ) : null}
    </>
  );
}

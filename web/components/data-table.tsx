import { flexRender, type Row, type Table as TableInstance } from '@tanstack/react-table';
import type { ReactNode } from 'react';
import { Table, TBody, Td, Th, THead, Tr } from './table';

function sortLabel(direction: false | 'asc' | 'desc'): 'ascending' | 'descending' | 'none' {
  return direction === 'asc' ? 'ascending' : direction === 'desc' ? 'descending' : 'none';
}

export interface DataTableProps<TData> {
  /** The TanStack Table instance (from useReactTable) to draw. */
  table: TableInstance<TData>;
  /** The table's accessible name. */
  'aria-label': string;
  /** Extra classes for a body row, from its data. */
  rowClassName?: (row: Row<TData>) => string | undefined;
  /** Shown in one full-width row when there are no rows; without it an empty table has an empty body. */
  emptyMessage?: ReactNode;
}

/**
 * Draws a TanStack Table instance with the app's table parts: header groups, rows and cells.
 * When the instance sorts (it was given `getSortedRowModel`), each sortable header is a button
 * that toggles the order and carries `aria-sort`.
 */
export function DataTable<TData>({ table, 'aria-label': label, rowClassName, emptyMessage }: DataTableProps<TData>) {
  const sorts = table.options.getSortedRowModel !== undefined;
  const rows = table.getRowModel().rows;
  return (
    <Table aria-label={label}>
      <THead>
        {table.getHeaderGroups().map((group) => (
          <tr key={group.id}>
            {group.headers.map((header) => {
              const content = flexRender(header.column.columnDef.header, header.getContext());
              if (!sorts || !header.column.getCanSort()) return <Th key={header.id}>{content}</Th>;
              const sorted = header.column.getIsSorted();
              return (
                <Th key={header.id} aria-sort={sortLabel(sorted)}>
                  <button
                    type="button"
                    onClick={header.column.getToggleSortingHandler()}
                    className="inline-flex items-center gap-1 whitespace-nowrap rounded-sm uppercase tracking-wide hover:text-night-100"
                  >
                    {content}
                    <span aria-hidden="true" className="text-ember-400">
                      {sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '·'}
                    </span>
                  </button>
                </Th>
              );
            })}
          </tr>
        ))}
      </THead>
      <TBody>
        {rows.length === 0 && emptyMessage !== undefined ? (
          <tr>
            <Td colSpan={table.getVisibleLeafColumns().length} className="py-6 text-center text-night-300">
              {emptyMessage}
            </Td>
          </tr>
        ) : (
          rows.map((row) => (
            <Tr key={row.id} className={rowClassName?.(row)}>
              {row.getVisibleCells().map((cell) => (
                <Td key={cell.id}>{flexRender(cell.column.columnDef.cell, cell.getContext())}</Td>
              ))}
            </Tr>
          ))
        )}
      </TBody>
    </Table>
  );
}

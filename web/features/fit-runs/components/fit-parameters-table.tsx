import { createColumnHelper, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { DataTable } from '../../../components/data-table';
import { cn } from '../../../lib/cn';
import type { FittedParameter } from '../api/get-fit-run';
import { formatSigma, formatUncertainty } from '../lib/format-fit';

/** Changes larger than this many σ from the starting value are highlighted. */
export const LARGE_CHANGE_SIGMA = 3;

interface ParameterRow extends FittedParameter {
  path: string;
}

const column = createColumnHelper<ParameterRow>();
const columns = [
  column.accessor('path', { header: 'Parameter', cell: (i) => <span className="font-mono text-night-100">{i.getValue()}</span> }),
  column.display({
    id: 'value',
    header: () => (
      <span className="whitespace-nowrap">
        Fitted value ± 1<span className="normal-case">σ</span>
      </span>
    ),
    cell: ({ row }) => (
      <span className="font-mono tabular-nums">
        {row.original.value} ± {formatUncertainty(row.original.uncertainty)}
        {row.original.unit ? <span className="ml-1 text-night-400">{row.original.unit}</span> : null}
      </span>
    ),
  }),
  column.accessor('startValue', { header: 'Start value', cell: (i) => <span className="font-mono tabular-nums text-night-300">{i.getValue()}</span> }),
  column.accessor('changeSigma', {
    header: 'Change',
    cell: (i) => {
      const large = Math.abs(i.getValue()) > LARGE_CHANGE_SIGMA;
      return (
        <span className={cn('font-mono tabular-nums', large ? 'font-semibold text-ember-300' : 'text-night-200')}>
          {formatSigma(i.getValue())}
          {large ? <span className="ml-1 text-xs font-normal">(more than {LARGE_CHANGE_SIGMA}σ)</span> : null}
        </span>
      );
    },
  }),
];

/** The fitted parameters in the order the API lists them; moves over 3σ from the start stand out. */
export function FitParametersTable({ parameters }: { parameters: Record<string, FittedParameter> }) {
  const rows = Object.entries(parameters).map(([path, p]) => ({ path, ...p }));
  const table = useReactTable({ data: rows, columns, getCoreRowModel: getCoreRowModel(), getRowId: (r) => r.path });
  return (
    <DataTable table={table} aria-label="Fitted parameters" rowClassName={(row) => (Math.abs(row.original.changeSigma) > LARGE_CHANGE_SIGMA ? 'bg-ember-500/5' : undefined)} />
  );
}

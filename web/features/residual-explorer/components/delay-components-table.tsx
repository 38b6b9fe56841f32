import { useMemo } from 'react';
import { EmptyState } from '../../../components/empty-state';
import { Table, TBody, Td, Th, THead, Tr } from '../../../components/table';
import { formatCount, formatMjd } from '../../../lib/format';
import { chooseDelayUnit, formatDelay } from '../lib/panels/delay-units';

/** One selected TOA's chain of corrections, seconds (ExplorerTable.delays, docs/formats.md §4 `delays`). */
export interface DelayComponentsRow {
  toaId: number;
  /** the arrival time as stored, MJD text */
  mjd: string;
  clockS: number;
  ttMinusUtcS: number;
  tdbMinusTtS: number;
  roemerS: number;
  shapiroS: number;
  dispersionS: number;
  companionsS: number;
}

/** At most this many rows are drawn; the rest are counted. */
export const MAX_DELAY_ROWS = 50;

type DelayKey = Exclude<keyof DelayComponentsRow, 'toaId' | 'mjd'>;

const COLUMNS: { key: DelayKey; title: string; sign: '+' | '−' }[] = [
  { key: 'clockS', title: 'Clock', sign: '+' },
  { key: 'ttMinusUtcS', title: 'TT − UTC', sign: '+' },
  { key: 'tdbMinusTtS', title: 'TDB − TT', sign: '+' },
  { key: 'roemerS', title: 'Roemer', sign: '+' },
  { key: 'shapiroS', title: 'Shapiro', sign: '−' },
  { key: 'dispersionS', title: 'Dispersion', sign: '−' },
  { key: 'companionsS', title: 'Companions', sign: '−' },
];

/**
 * The corrections the engine applied to each selected TOA, one column per step of the chain, each
 * column in the unit that reads best for its size (s, ms, µs or ns, to the nanosecond). The caption
 * states how the steps combine. Empty until TOAs are selected; at most MAX_DELAY_ROWS rows.
 */
export function DelayComponentsTable({ rows }: { rows: readonly DelayComponentsRow[] }) {
  const shown = rows.slice(0, MAX_DELAY_ROWS);
  const units = useMemo(
    () => Object.fromEntries(COLUMNS.map((c) => [c.key, chooseDelayUnit(shown.map((r) => r[c.key]))])) as Record<DelayKey, ReturnType<typeof chooseDelayUnit>>,
    [shown],
  );
  if (rows.length === 0) {
    return (
      <EmptyState title="No TOAs selected">
        Select TOAs on the plot to see their corrections: box or lasso a few points and their delay chain appears here.
      </EmptyState>
    );
  }
  return (
    <div className="flex flex-col gap-2">
      <p className="text-sm text-night-300" aria-live="polite">
        {rows.length > MAX_DELAY_ROWS
          ? `Showing the first ${MAX_DELAY_ROWS} of ${formatCount(rows.length)} selected TOAs.`
          : `${formatCount(rows.length)} selected ${rows.length === 1 ? 'TOA' : 'TOAs'}.`}
      </p>
      <Table aria-label="Delay components of the selected TOAs" aria-describedby="delay-components-caption">
        <caption id="delay-components-caption" className="caption-bottom px-4 py-3 text-left text-xs text-night-400">
          Barycentric arrival at infinite frequency = arrival + clock + (TT − UTC) + (TDB − TT) + Roemer − Shapiro − dispersion;
          the companions’ orbit delays are then subtracted to give the emission time. The sign column heads (+ added, − subtracted)
          say which. Roemer is positive when the observatory is on the pulsar’s side of the barycentre. Each column has its own
          unit, shown in its head.
        </caption>
        <THead>
          <tr>
            <Th scope="col" className="px-2">TOA</Th>
            <Th scope="col" className="px-2">MJD</Th>
            {COLUMNS.map((c) => (
              <Th key={c.key} scope="col" className="px-2 text-right">
                <span className="whitespace-nowrap normal-case">
                  <span aria-label={c.sign === '+' ? 'added' : 'subtracted'} className="mr-1 font-mono text-night-400">
                    {c.sign}
                  </span>
                  {c.title} ({units[c.key].symbol})
                </span>
              </Th>
            ))}
          </tr>
        </THead>
        <TBody>
          {shown.map((r) => (
            <Tr key={r.toaId}>
              <Td className="px-2 font-mono text-night-300">#{r.toaId}</Td>
              <Td className="whitespace-nowrap px-2 font-mono tabular-nums">{formatMjd(r.mjd, 10)}</Td>
              {COLUMNS.map((c) => (
                <Td key={c.key} className="whitespace-nowrap px-2 text-right font-mono tabular-nums">
                  {formatDelay(r[c.key], units[c.key])}
                </Td>
              ))}
            </Tr>
          ))}
        </TBody>
      </Table>
    </div>
  );
}

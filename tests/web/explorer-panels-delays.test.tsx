import { cleanup, render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { DelayComponentsTable, MAX_DELAY_ROWS, type DelayComponentsRow } from '../../web/features/residual-explorer/components/delay-components-table';
import { chooseDelayUnit, formatDelay } from '../../web/features/residual-explorer/lib/panels/delay-units';

afterEach(cleanup);

// Invented but typical sizes: TT − UTC = 69.184 s (37 leap seconds + 32.184 s, from memory), Roemer up to ~500 s.
const row = (toaId: number, roemerS: number): DelayComponentsRow => ({
  toaId,
  mjd: '58123.1234567890123456',
  clockS: 2.5e-6,
  ttMinusUtcS: 69.184,
  tdbMinusTtS: -1.6123e-3,
  roemerS,
  shapiroS: 1.234e-5,
  dispersionS: 0.0421,
  companionsS: -3.21e-7,
});

describe('delay units', () => {
  it('chooses the largest unit in which the biggest value is at least 1', () => {
    expect(chooseDelayUnit([69.184, 0.5]).symbol).toBe('s');
    expect(chooseDelayUnit([-1.6e-3]).symbol).toBe('ms');
    expect(chooseDelayUnit([2e-6, -5e-7]).symbol).toBe('µs');
    expect(chooseDelayUnit([3.2e-7]).symbol).toBe('ns');
    expect(chooseDelayUnit([0, Number.NaN]).symbol).toBe('ns');
  });
  it('formats to the nanosecond with a true minus sign and no negative zero', () => {
    expect(formatDelay(-1.6123e-3, chooseDelayUnit([1e-3]))).toBe('−1.612300');
    expect(formatDelay(412.3456789012, chooseDelayUnit([1]))).toBe('412.345678901');
    expect(formatDelay(-3.21e-7, chooseDelayUnit([1e-6]))).toBe('−0.321');
    expect(formatDelay(-1e-13, chooseDelayUnit([1e-6]))).toBe('0.000');
    expect(formatDelay(undefined, chooseDelayUnit([1]))).toBe('—');
  });
});

describe('DelayComponentsTable', () => {
  it('tells the user to select TOAs when none are selected', () => {
    render(<DelayComponentsTable rows={[]} />);
    expect(screen.getByText(/Select TOAs on the plot to see their corrections/)).toBeTruthy();
    expect(screen.queryByRole('table')).toBeNull();
  });

  it('shows each step with its unit and sign, and the sign convention', () => {
    render(<DelayComponentsTable rows={[row(1, -412.3456789012), row(2, 3.5)]} />);
    const table = screen.getByRole('table', { name: 'Delay components of the selected TOAs' });
    const heads = within(table).getAllByRole('columnheader').map((h) => h.textContent);
    expect(heads).toEqual(['TOA', 'MJD', '+Clock (µs)', '+TT − UTC (s)', '+TDB − TT (ms)', '+Roemer (s)', '−Shapiro (µs)', '−Dispersion (ms)', '−Companions (ns)']);
    const cells = within(within(table).getAllByRole('row')[1]).getAllByRole('cell').map((c) => c.textContent);
    expect(cells).toEqual(['#1', '58123.1234567890', '2.500', '69.184000000', '−1.612300', '−412.345678901', '12.340', '42.100000', '−321.0']);
    expect(table.querySelector('caption')?.textContent).toMatch(/arrival \+ clock \+ \(TT − UTC\) \+ \(TDB − TT\) \+ Roemer − Shapiro − dispersion/);
    expect(screen.getByText('2 selected TOAs.')).toBeTruthy();
  });

  it('draws at most 50 rows and counts the rest', () => {
    render(<DelayComponentsTable rows={Array.from({ length: 120 }, (_, i) => row(i + 1, 100 + i))} />);
    expect(within(screen.getByRole('table')).getAllByRole('row')).toHaveLength(MAX_DELAY_ROWS + 1);
    expect(screen.getByText('Showing the first 50 of 120 selected TOAs.')).toBeTruthy();
  });
});

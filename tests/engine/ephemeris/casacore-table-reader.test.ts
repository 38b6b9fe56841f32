import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import fixture from '../../fixtures/ephemeris/de405-coefficients.json';
import {
  readCasacoreChebyshevTable,
  readCasacoreTableHeader,
} from '../../../worker/timing/ephemeris/casacore-table-reader';
import { DE405_POINTER_TABLE } from '../../../worker/timing/ephemeris/de405-record-layout';

const DIRECTORY = '/usr/share/casacore/data/ephemerides/DE405';
const table = readCasacoreChebyshevTable(DIRECTORY, 1018);

/** Neumaier-compensated sum, to compare with Python's math.fsum. */
function compensatedSum(values: ArrayLike<number>): number {
  let sum = 0;
  let compensation = 0;
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    const t = sum + v;
    compensation += Math.abs(sum) >= Math.abs(v) ? sum - t + v : v - t + sum;
    sum = t;
  }
  return sum + compensation;
}

// Reference: python-casacore reading the same table (tests/fixtures/scripts/de405_coefficients.py).
describe('casacore DE405 table against python-casacore', () => {
  it('has the same row count and table name', () => {
    expect(table.header.rowCount).toBe(fixture.rowCount);
    expect(table.header.tableName).toBe('DE405');
  });

  it('reads every numeric table keyword exactly', () => {
    for (const [name, value] of Object.entries(fixture.keywords)) {
      expect(table.header.keywords[name], name).toBe(value);
    }
    expect(Object.keys(fixture.keywords).length).toBeGreaterThan(100);
  });

  it('reads the whole MJD column exactly', () => {
    expect(Array.from(table.rowStartMjd)).toEqual(fixture.mjdColumn);
  });

  it.each(fixture.rows)('row $row: coefficient subset exact, sums equal', (row) => {
    const start = row.row * 1018;
    const coefficients = table.coefficients.subarray(start, start + 1018);
    expect(coefficients.length).toBe(row.length);
    for (const [index, value] of Object.entries(row.subset)) {
      expect(coefficients[Number(index)], `x[${index}]`).toBe(value);
    }
    const sum = compensatedSum(coefficients);
    expect(Math.abs(sum - row.sum)).toBeLessThanOrEqual(1e-15 * Math.abs(row.sumOfSquares) ** 0.5);
    const squares = compensatedSum(Array.from(coefficients, (v) => v * v));
    expect(Math.abs(squares - row.sumOfSquares)).toBeLessThanOrEqual(1e-14 * row.sumOfSquares);
  });

  it('uses the pointer table that the table itself declares', () => {
    expect(Array.from(DE405_POINTER_TABLE)).toEqual(fixture.pointerTable);
  });

  it('rejects a file that is not a casacore table with an error naming the byte', () => {
    const bogus = Buffer.from(readFileSync(`${DIRECTORY}/table.dat`));
    bogus.writeUInt32BE(0x12345678, 0);
    expect(() => readCasacoreTableHeader(bogus)).toThrow(/magic.*byte 0/);
    expect(() => readCasacoreTableHeader(bogus.subarray(0, 40))).toThrow(/casacore table/);
  });
});

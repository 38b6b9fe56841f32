/**
 * The compressed residual columns of fit_residuals (api/db/residual-columns.ts):
 * bit-exact round trips, edge values, label dictionaries, and refusals.
 */
import { describe, expect, it } from 'vitest';
import {
  decodeFloat64Column,
  decodeLabelColumn,
  decodeResidualColumns,
  decodeTextColumn,
  encodeFloat64Column,
  encodeLabelColumn,
  encodeResidualColumns,
  encodeTextColumn,
  type ResidualColumns,
} from '../../api/db/residual-columns';

describe('float64 columns', () => {
  it('round-trip every bit, including ±0, subnormals, extremes and Infinity', () => {
    const values = Float64Array.from([0, -0, 5e-324, -1.7976931348623157e308, Infinity, -Infinity, 0.1 + 0.2, 2 ** 53 + 2, Math.PI]);
    const back = decodeFloat64Column(encodeFloat64Column(values), values.length);
    expect(Array.from(new Uint8Array(back.buffer))).toEqual(Array.from(new Uint8Array(values.buffer)));
    expect(Object.is(back[1], -0)).toBe(true);
  });

  it('refuse a count that does not match the stored values', () => {
    const blob = encodeFloat64Column(Float64Array.from([1, 2, 3]));
    expect(() => decodeFloat64Column(blob, 4)).toThrow(/24 bytes for 4 values/);
  });

  it('round-trip an empty column', () => {
    expect(decodeFloat64Column(encodeFloat64Column(new Float64Array(0)), 0)).toHaveLength(0);
  });
});

describe('text and label columns', () => {
  it('keep MJD text digit for digit', () => {
    const mjd = ['58000.1234567890123456789012345678901234567', '60000', '51544.5'];
    expect(decodeTextColumn(encodeTextColumn(mjd), 3)).toEqual(mjd);
  });

  it('refuse a text value with a line break', () => {
    expect(() => encodeTextColumn(['a\nb'])).toThrow(/line break/);
  });

  it('dictionary-encode labels, including commas, quotes and non-ASCII text', () => {
    const labels = ['wide,band', 'wide,band', 'nar"row', 'Ørsted-β', 'wide,band', ''];
    expect(decodeLabelColumn(encodeLabelColumn(labels), labels.length)).toEqual(labels);
  });

  it('compress repeated labels to far less than one byte per row', () => {
    const labels = Array.from({ length: 100_000 }, (_, i) => (i % 3 === 0 ? 'wideband-1' : 'narrow-2'));
    expect(encodeLabelColumn(labels).length).toBeLessThan(100_000 / 4);
  });
});

describe('a residual set', () => {
  const set: ResidualColumns = {
    count: 3,
    toaIds: Float64Array.from([7, 2 ** 40, 9]),
    mjd: ['58000.5', '58001.25', '58002.125'],
    residualUs: Float64Array.from([0.25, -1.5, 1e-9]),
    uncertaintyUs: Float64Array.from([1, 2, 3]),
    frequencyMhz: Float64Array.from([1400, Infinity, 820]),
    backend: ['a', 'b', 'a'],
    observatory: ['site-1', 'ssb', 'site-1'],
  };

  it('round-trips through the row encoding', () => {
    expect(decodeResidualColumns(encodeResidualColumns(set))).toEqual(set);
  });

  it('refuses columns of different lengths', () => {
    expect(() => encodeResidualColumns({ ...set, backend: ['a'] })).toThrow(/differ from count 3/);
  });
});

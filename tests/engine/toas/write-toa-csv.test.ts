import { describe, expect, it } from 'vitest';
import { readToaCsv } from '../../../worker/timing/toas/read-toa-csv';
import { writeToaCsv } from '../../../worker/timing/toas/write-toa-csv';
import type { Toa } from '../../../worker/timing/toas/toa';
import { formatMjd, parseMjd } from '../../../worker/timing/time/mjd-string';
import { mjdFromParts } from '../../../worker/timing/time/mjd-arithmetic';

const known = new Set(['harrow-ridge']);
const toa = (over: Partial<Toa>): Toa => ({
  row: 1, line: 2, mjd: parseMjd('58000.5'), uncertaintyUs: 1, frequencyMhz: 1400, observatory: 'ssb', backend: 'default', pulseNumber: null, labels: {}, ...over,
});

function readBack(text: string): Toa[] {
  const result = readToaCsv(text, { knownObservatories: known });
  if (!result.ok) throw new Error(JSON.stringify(result.errors));
  return result.toas;
}

describe('writeToaCsv', () => {
  it('writes the standard header, inf, and labels last', () => {
    const text = writeToaCsv([toa({ frequencyMhz: Infinity, labels: { session: 'a, "b"' } })], { fractionDigits: 3, comments: ['made by a test', 'two\nlines'] });
    expect(text).toBe('# made by a test\n# two\n# lines\nmjd,uncertainty_us,frequency_mhz,observatory,backend,session\n58000.500,1,inf,ssb,default,"a, ""b"""\n');
  });
  it('adds pulse_number only when some row has one', () => {
    expect(writeToaCsv([toa({})]).split('\n')[0]).not.toContain('pulse_number');
    const text = writeToaCsv([toa({ pulseNumber: 42 }), toa({ pulseNumber: null })]);
    expect(text.split('\n').slice(0, 3).map((l) => l.split(',')[5])).toEqual(['pulse_number', '42', '']);
  });
  it('round trip write → read is exact to the printed digits', () => {
    let state = 2026;
    const next = () => {
      state = (state * 1103515245 + 12345) % 2 ** 31;
      return state / 2 ** 31;
    };
    const toas: Toa[] = Array.from({ length: 200 }, (_, i) => toa({
      row: i + 1,
      line: i + 2,
      mjd: mjdFromParts(50_000 + Math.floor(next() * 20_000), [next() * 1e-17, next()]),
      uncertaintyUs: 0.01 + next() * 100,
      frequencyMhz: i % 7 === 0 ? Infinity : 100 + next() * 3000,
      observatory: i % 2 === 0 ? 'harrow-ridge' : 'geocenter',
      backend: `wide band ${i % 3}`,
      pulseNumber: i % 5 === 0 ? null : Math.round((next() - 0.5) * 1e12),
      labels: i % 4 === 0 ? { note: ` spaced, "quoted" ${i}` } : { receiver: 'L-band' },
    }));
    for (const fractionDigits of [18, 25]) {
      const back = readBack(writeToaCsv(toas, { fractionDigits }));
      expect(back).toHaveLength(toas.length);
      back.forEach((got, i) => {
        const want = toas[i];
        expect(formatMjd(got.mjd, fractionDigits)).toBe(formatMjd(want.mjd, fractionDigits));
        expect(got.mjd).toEqual(parseMjd(formatMjd(want.mjd, fractionDigits)));
        expect({ ...got, mjd: null }).toEqual({
          ...want,
          mjd: null,
          labels: { note: want.labels.note ?? '', receiver: want.labels.receiver ?? '' },
        });
      });
    }
  });
  it('refuses values the format cannot carry', () => {
    expect(() => writeToaCsv([toa({ labels: { note: 'two\nlines' } })])).toThrow(RangeError);
    expect(() => writeToaCsv([toa({ labels: { mjd: 'x' } })])).toThrow(RangeError);
  });
});

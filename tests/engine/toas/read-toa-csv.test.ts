import { describe, expect, it } from 'vitest';
import { formatToaFileErrors, readToaCsv } from '../../../worker/timing/toas/read-toa-csv';
import type { ToaFileResult } from '../../../worker/timing/toas/read-toa-csv';
import { formatMjd, parseMjd } from '../../../worker/timing/time/mjd-string';

const known = new Set(['harrow-ridge', 'cardenal-plateau']);
const read = (input: string | Uint8Array, maxErrors?: number) => readToaCsv(input, { knownObservatories: known, maxErrors });
const HEADER = 'mjd,uncertainty_us,frequency_mhz,observatory';

function errorsOf(result: ToaFileResult) {
  if (result.ok) throw new Error('expected the file to be rejected');
  return result.errors;
}
function toasOf(result: ToaFileResult) {
  if (!result.ok) throw new Error(`expected the file to be accepted: ${formatToaFileErrors(result.errors).join('; ')}`);
  return result.toas;
}

describe('readToaCsv: good files', () => {
  it('reads the required columns, defaults and labels', () => {
    const result = read(`${HEADER},session\n58000.5,1.5,1400,harrow-ridge,s1\n58001.25,0.2,inf,ssb,s2\n`);
    const toas = toasOf(result);
    expect(toas).toEqual([
      { row: 1, line: 2, mjd: parseMjd('58000.5'), uncertaintyUs: 1.5, frequencyMhz: 1400, observatory: 'harrow-ridge', backend: 'default', pulseNumber: null, labels: { session: 's1' } },
      { row: 2, line: 3, mjd: parseMjd('58001.25'), uncertaintyUs: 0.2, frequencyMhz: Infinity, observatory: 'ssb', backend: 'default', pulseNumber: null, labels: { session: 's2' } },
    ]);
    expect(result.ok && result.columns).toEqual(['mjd', 'uncertainty_us', 'frequency_mhz', 'observatory', 'session']);
    expect(result.ok && result.labelColumns).toEqual(['session']);
  });
  it('takes columns in any order, with backend and pulse numbers', () => {
    const toas = toasOf(read('observatory,pulse_number,backend,frequency_mhz,mjd,uncertainty_us\ngeocenter,-12,wideband-2,820.5,57000.75,3\n'));
    expect(toas[0]).toMatchObject({ observatory: 'geocenter', pulseNumber: -12, backend: 'wideband-2', frequencyMhz: 820.5, uncertaintyUs: 3 });
    expect(toas[0].mjd).toEqual(parseMjd('57000.75'));
  });
  it('skips comments and blank lines and counts physical lines', () => {
    const toas = toasOf(read(`# made by hand\n\n# another\n${HEADER}\n# mid-file comment\n58000.1,1,1400,ssb\n   \n58000.2,1,1400,ssb\n`));
    expect(toas.map((t) => [t.row, t.line])).toEqual([[1, 6], [2, 8]]);
  });
  it('accepts CRLF line ends and a byte-order mark (bytes and string)', () => {
    const text = `\uFEFF${HEADER}\r\n58000.1,1,1400,ssb\r\n58000.2,2,1400,ssb\r\n`;
    for (const input of [text, new TextEncoder().encode(text)]) {
      const result = read(input);
      expect(toasOf(result).map((t) => t.uncertaintyUs)).toEqual([1, 2]);
      expect(result.ok && result.columns[0]).toBe('mjd');
    }
  });
  it('keeps an MJD with 40 fractional digits to the stored precision (~1e-32 day)', () => {
    const text40 = '58000.1234567890123456789012345678901234567890';
    const [toa] = toasOf(read(`${HEADER}\n${text40},1,1400,ssb\n`));
    expect(toa.mjd).toEqual(parseMjd(text40));
    expect(formatMjd(toa.mjd, 30)).toBe('58000.123456789012345678901234567890'.slice(0, 36));
  });
  it('reads quoted fields: embedded commas, doubled quotes, spaces kept inside quotes', () => {
    const toas = toasOf(read(`${HEADER},note,"back end"\n58000.1,1,1400,"ssb","a, b","x ""y"" "\n`));
    expect(toas[0].labels).toEqual({ note: 'a, b', 'back end': 'x "y" ' });
  });
  it('trims spaces around unquoted fields', () => {
    const toas = toasOf(read(` mjd , uncertainty_us,frequency_mhz,observatory\n 58000.1 , 1 ,1400 , ssb\n`));
    expect(toas[0].observatory).toBe('ssb');
  });
  it('reads a file without a final line end, and empty backend/pulse fields as defaults', () => {
    const toas = toasOf(read(`${HEADER},backend,pulse_number\n58000.1,1,1400,ssb,,`));
    expect(toas[0]).toMatchObject({ backend: 'default', pulseNumber: null });
  });
});

describe('readToaCsv: bad files, each error with its line and column', () => {
  it('empty file', () => {
    expect(errorsOf(read(''))).toEqual([{ line: 1, column: null, message: 'the file is empty: expected a header line naming the columns (mjd, uncertainty_us, frequency_mhz, observatory)' }]);
    expect(errorsOf(read('# only a comment\n\n'))[0].message).toMatch(/^the file is empty/);
  });
  it('header only', () => {
    expect(errorsOf(read(`# c\n${HEADER}\n`))).toEqual([{ line: 2, column: null, message: 'the file has a header but no data rows' }]);
  });
  it('missing required column, named (with a hint for wrong case)', () => {
    expect(errorsOf(read('MJD,uncertainty_us,observatory\n58000,1,ssb\n'))).toEqual([
      { line: 1, column: 'mjd', message: 'required column "mjd" is missing from the header (found "MJD"; column names are lower case)' },
      { line: 1, column: 'frequency_mhz', message: 'required column "frequency_mhz" is missing from the header' },
    ]);
  });
  it('duplicate header names', () => {
    expect(errorsOf(read(`${HEADER},mjd\n58000,1,1400,ssb,58000\n`))).toEqual([{ line: 1, column: 'mjd', message: 'duplicate column name "mjd" in the header' }]);
  });
  it('non-numeric values name the value', () => {
    expect(errorsOf(read(`${HEADER}\n58000.x,abc,1.4e3q,ssb\n`))).toEqual([
      { line: 2, column: 'mjd', message: '"58000.x" is not a plain decimal MJD (digits with an optional point, no exponent)' },
      { line: 2, column: 'uncertainty_us', message: '"abc" is not a number' },
      { line: 2, column: 'frequency_mhz', message: '"1.4e3q" is not a number' },
    ]);
  });
  it('an MJD in exponent form is rejected', () => {
    expect(errorsOf(read(`${HEADER}\n5.8e4,1,1400,ssb\n`))[0]).toMatchObject({ line: 2, column: 'mjd' });
  });
  it.each([['0', 'must be > 0 µs (got "0")'], ['-1.5', 'must be > 0 µs (got "-1.5")'], ['', 'empty value (a number is required)']])(
    'uncertainty %j', (value, message) => {
      expect(errorsOf(read(`${HEADER}\n58000,${value},1400,ssb\n`))).toEqual([{ line: 2, column: 'uncertainty_us', message }]);
    });
  it.each([['0', 'must be > 0 MHz or inf (got "0")'], ['-430', 'must be > 0 MHz or inf (got "-430")'], ['1e999', '"1e999" is out of range']])(
    'frequency %j', (value, message) => {
      expect(errorsOf(read(`${HEADER}\n58000,1,${value},ssb\n`))).toEqual([{ line: 2, column: 'frequency_mhz', message }]);
    });
  it('unknown observatory: the message names the code and suggests registering it', () => {
    expect(errorsOf(read(`${HEADER}\n58000,1,1400,far-away\n`))).toEqual([
      { line: 2, column: 'observatory', message: 'unknown observatory "far-away": register it first (or use ssb or geocenter)' },
    ]);
  });
  it('pulse numbers must be plain integers below 2^53', () => {
    const errors = errorsOf(read(`${HEADER},pulse_number\n58000,1,1400,ssb,1.5\n58001,1,1400,ssb,9007199254740992\n58002,1,1400,ssb,1e3\n`));
    expect(errors).toEqual([
      { line: 2, column: 'pulse_number', message: '"1.5" is not an integer' },
      { line: 3, column: 'pulse_number', message: '"9007199254740992" is too large (|N| must be below 2^53)' },
      { line: 4, column: 'pulse_number', message: '"1e3" is not an integer' },
    ]);
  });
  it('too many and too few fields', () => {
    expect(errorsOf(read(`${HEADER}\n58000,1,1400,ssb,extra\n58001,1,1400\n`))).toEqual([
      { line: 2, column: null, message: 'too many fields: found 5, the header has 4' },
      { line: 3, column: null, message: 'too few fields: found 3, the header has 4' },
    ]);
  });
  it('a quoted field left open (no line breaks inside fields)', () => {
    expect(errorsOf(read(`${HEADER},note\n58000,1,1400,ssb,"two\nlines"\n`))[0]).toEqual({
      line: 2, column: null, message: 'field 5: the quoted field is not closed on this line (line breaks inside fields are not supported)',
    });
  });
  it('binary garbage: NUL bytes', () => {
    const bytes = new Uint8Array([0x6d, 0x6a, 0x64, 0x0a, 0x00, 0x01, 0x02, 0xff]);
    expect(errorsOf(read(bytes))).toEqual([{ line: 2, column: null, message: 'the file contains NUL bytes: it looks like a binary file, not UTF-8 CSV text' }]);
  });
  it('binary garbage: invalid UTF-8 names the byte and its line', () => {
    const bytes = new TextEncoder().encode(`${HEADER}\n58000,1,1400,ssb\n58001,1,1400,ss_\n`);
    bytes[bytes.length - 2] = 0xc3; // a lead byte followed by a line feed: invalid
    expect(errorsOf(read(bytes))).toEqual([{ line: 3, column: null, message: `the file is not UTF-8 text (invalid byte 0xc3 at byte ${bytes.length - 2}); save it as UTF-8 CSV` }]);
  });
  it('reports every error of every row, no partial result', () => {
    const rows = Array.from({ length: 150 }, (_, i) => `58000.${i},${i % 2 === 0 ? '-1' : '1'},1400,ssb`);
    const result = read(`${HEADER}\n${rows.join('\n')}\n`);
    expect(result.ok).toBe(false);
    expect(!result.ok && result.errorCount).toBe(75);
    expect(errorsOf(result).map((e) => e.line)).toEqual(Array.from({ length: 75 }, (_, i) => 2 + 2 * i));
  });
  it('lists only the first maxErrors errors but counts all', () => {
    const rows = Array.from({ length: 250 }, () => '58000,0,0,nowhere');
    const result = read(`${HEADER}\n${rows.join('\n')}\n`);
    expect(!result.ok && [result.errors.length, result.errorCount]).toEqual([100, 750]);
    const few = read(`${HEADER}\n${rows.join('\n')}\n`, 5);
    expect(!few.ok && [few.errors.length, few.errorCount]).toEqual([5, 750]);
  });
});

describe('formatToaFileErrors', () => {
  it('writes `line N, column C: message`, or `line N: message` without a column', () => {
    expect(formatToaFileErrors([
      { line: 4, column: 'uncertainty_us', message: 'must be > 0 µs (got "0")' },
      { line: 7, column: null, message: 'too many fields: found 5, the header has 4' },
    ])).toEqual(['line 4, column uncertainty_us: must be > 0 µs (got "0")', 'line 7: too many fields: found 5, the header has 4']);
  });
});

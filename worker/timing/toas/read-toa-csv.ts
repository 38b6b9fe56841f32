/**
 * Reading the arrival-time file (docs/formats.md §1) into `Toa`s.
 *
 * All or nothing: a file with any bad row yields every error found (the first
 * `maxErrors` listed, all counted) and no arrival times. Rows are checked one
 * field at a time, so one row can report several errors.
 *
 * Speed: one pass over the text; lines are cut with indexOf and split with
 * String.split unless they hold a quote (csv-text.ts), and each MJD is read by
 * parseMjd straight from its text. 500 000 rows (~50 MB) take a few seconds
 * (measured by tests/engine/toas/bench-read-toa-csv.ts).
 */
import type { Toa } from './toa';
import { parseMjd } from '../time/mjd-string';
import { RESERVED_OBSERVATORY_CODES } from '../earth/observatory';
import { decodeCsvText, splitCsvLine } from './csv-text';

export interface ToaFileError {
  line: number; // 1-based physical line of the file
  column: string | null; // column name, or null for a problem with the whole line or file
  message: string;
}

export type ToaFileResult =
  | { ok: true; toas: Toa[]; columns: string[]; labelColumns: string[] }
  | { ok: false; errors: ToaFileError[]; errorCount: number };

export interface ReadToaCsvOptions {
  knownObservatories: ReadonlySet<string>; // registered codes (`ssb`, `geocenter` are always accepted)
  maxErrors?: number; // errors listed in the result (default 100); all are counted
  keepMjdText?: boolean; // also keep each row's MJD text in `Toa.mjdText` (for lossless storage of every digit)
}

export const REQUIRED_TOA_COLUMNS = ['mjd', 'uncertainty_us', 'frequency_mhz', 'observatory'] as const;
export const OPTIONAL_TOA_COLUMNS = ['backend', 'pulse_number'] as const;
export const DEFAULT_BACKEND = 'default';
const DEFAULT_MAX_ERRORS = 100;
const DECIMAL_NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const INTEGER = /^[+-]?\d+$/;
const PULSE_NUMBER_LIMIT = 2 ** 53;
const RESERVED: ReadonlySet<string> = new Set(RESERVED_OBSERVATORY_CODES);

/** Collects errors: keeps the first `limit`, counts all. */
class ErrorList {
  readonly listed: ToaFileError[] = [];
  count = 0;
  constructor(private readonly limit: number) {}
  add(line: number, column: string | null, message: string): void {
    this.count += 1;
    if (this.listed.length < this.limit) this.listed.push({ line, column, message });
  }
}

interface HeaderLayout {
  columns: string[];
  labelColumns: string[];
  index: Record<(typeof REQUIRED_TOA_COLUMNS)[number] | (typeof OPTIONAL_TOA_COLUMNS)[number], number>;
  labelIndex: number[];
}

function quoteValue(text: string): string {
  return `"${text.length > 60 ? `${text.slice(0, 60)}…` : text}"`;
}

function checkHeader(fields: string[], line: number, errors: ErrorList): HeaderLayout | null {
  const before = errors.count;
  const seen = new Set<string>();
  fields.forEach((name, i) => {
    if (name === '') errors.add(line, null, `header column ${i + 1} has no name`);
    else if (seen.has(name)) errors.add(line, name, `duplicate column name "${name}" in the header`);
    seen.add(name);
  });
  for (const required of REQUIRED_TOA_COLUMNS) {
    if (seen.has(required)) continue;
    const nearMiss = fields.find((f) => f.toLowerCase() === required);
    const hint = nearMiss === undefined ? '' : ` (found "${nearMiss}"; column names are lower case)`;
    errors.add(line, required, `required column "${required}" is missing from the header${hint}`);
  }
  if (errors.count > before) return null;
  const known = new Set<string>([...REQUIRED_TOA_COLUMNS, ...OPTIONAL_TOA_COLUMNS]);
  const labelIndex = fields.flatMap((name, i) => (known.has(name) ? [] : [i]));
  return {
    columns: fields,
    labelColumns: labelIndex.map((i) => fields[i]),
    index: {
      mjd: fields.indexOf('mjd'),
      uncertainty_us: fields.indexOf('uncertainty_us'),
      frequency_mhz: fields.indexOf('frequency_mhz'),
      observatory: fields.indexOf('observatory'),
      backend: fields.indexOf('backend'),
      pulse_number: fields.indexOf('pulse_number'),
    },
    labelIndex,
  };
}

/** A positive finite number from `text`, or the error message. */
function positiveNumber(text: string, unit: string): number | string {
  if (text === '') return 'empty value (a number is required)';
  if (!DECIMAL_NUMBER.test(text)) return `${quoteValue(text)} is not a number`;
  const x = Number(text);
  if (!Number.isFinite(x)) return `${quoteValue(text)} is out of range`;
  if (!(x > 0)) return `must be > 0 ${unit} (got ${quoteValue(text)})`;
  return x;
}

function readRow(fields: string[], layout: HeaderLayout, line: number, row: number, options: ReadToaCsvOptions, errors: ErrorList): Toa | null {
  const known = options.knownObservatories;
  const before = errors.count;
  const { index } = layout;

  const mjdText = fields[index.mjd];
  let mjd: Toa['mjd'] | null = null;
  if (mjdText === '') errors.add(line, 'mjd', 'empty value (an MJD is required)');
  else {
    try {
      mjd = parseMjd(mjdText);
    } catch {
      errors.add(line, 'mjd', `${quoteValue(mjdText)} is not a plain decimal MJD (digits with an optional point, no exponent)`);
    }
  }

  const uncertainty = positiveNumber(fields[index.uncertainty_us], 'µs');
  if (typeof uncertainty === 'string') errors.add(line, 'uncertainty_us', uncertainty);

  const frequencyText = fields[index.frequency_mhz];
  const frequency = frequencyText.toLowerCase() === 'inf' ? Infinity : positiveNumber(frequencyText, 'MHz or inf');
  if (typeof frequency === 'string') errors.add(line, 'frequency_mhz', frequency);

  const observatory = fields[index.observatory];
  if (observatory === '') errors.add(line, 'observatory', 'empty value (an observatory code, ssb or geocenter is required)');
  else if (!RESERVED.has(observatory) && !known.has(observatory)) {
    errors.add(line, 'observatory', `unknown observatory ${quoteValue(observatory)}: register it first (or use ssb or geocenter)`);
  }

  const backendText = index.backend === -1 ? '' : fields[index.backend];
  const backend = backendText === '' ? DEFAULT_BACKEND : backendText;

  let pulseNumber: number | null = null;
  const pulseText = index.pulse_number === -1 ? '' : fields[index.pulse_number];
  if (pulseText !== '') {
    const n = Number(pulseText);
    if (!INTEGER.test(pulseText)) errors.add(line, 'pulse_number', `${quoteValue(pulseText)} is not an integer`);
    else if (!(Math.abs(n) < PULSE_NUMBER_LIMIT)) errors.add(line, 'pulse_number', `${quoteValue(pulseText)} is too large (|N| must be below 2^53)`);
    else pulseNumber = n + 0; // "+ 0" keeps "-0" from becoming −0
  }

  if (errors.count > before || mjd === null) return null;
  const labels: Record<string, string> = {};
  for (const i of layout.labelIndex) labels[layout.columns[i]] = fields[i];
  const toa: Toa = {
    row,
    line,
    mjd,
    uncertaintyUs: uncertainty as number,
    frequencyMhz: frequency as number,
    observatory,
    backend,
    pulseNumber,
    labels,
  };
  if (options.keepMjdText === true) toa.mjdText = mjdText;
  return toa;
}

/**
 * Reads an arrival-time CSV file.
 *
 * @param input    file content: bytes (UTF-8, optional byte-order mark) or a string
 * @param options  registered observatory codes; how many errors to list
 * @returns        `{ ok: true, toas, columns, labelColumns }` or
 *                 `{ ok: false, errors, errorCount }` (Notes 1–3)
 *
 * Notes: 1. Comment lines start with `#` in their first character; blank lines
 *           (spaces only) are skipped; the first other line is the header.
 *        2. Row errors carry the column name; line- and file-level errors
 *           (field count, quoting, encoding, empty file) carry column null.
 *        3. `Toa.row` counts data rows from 1; `Toa.line` is the physical line.
 */
export function readToaCsv(input: string | Uint8Array, options: ReadToaCsvOptions): ToaFileResult {
  const errors = new ErrorList(options.maxErrors ?? DEFAULT_MAX_ERRORS);
  const decoded = decodeCsvText(input);
  if (!decoded.ok) {
    errors.add(decoded.line, null, decoded.message);
    return { ok: false, errors: errors.listed, errorCount: errors.count };
  }
  const { text } = decoded;
  const toas: Toa[] = [];
  let layout: HeaderLayout | null = null;
  let headerSeen = false;
  let headerLine = 0;
  let lineNumber = 0;
  let row = 0;
  for (let start = 0; start < text.length; ) {
    const newline = text.indexOf('\n', start);
    const end = newline === -1 ? text.length : newline;
    const contentEnd = end > start && text.charCodeAt(end - 1) === 13 ? end - 1 : end; // CRLF
    const line = text.slice(start, contentEnd);
    start = end + 1;
    lineNumber += 1;
    if (line.charCodeAt(0) === 35 || line.trim() === '') continue; // '#' comment or blank
    const split = splitCsvLine(line);
    if (!split.ok) {
      errors.add(lineNumber, null, split.message);
      if (!headerSeen) return { ok: false, errors: errors.listed, errorCount: errors.count };
      row += 1;
      continue;
    }
    if (!headerSeen) {
      headerSeen = true;
      headerLine = lineNumber;
      layout = checkHeader(split.fields, lineNumber, errors);
      if (layout === null) return { ok: false, errors: errors.listed, errorCount: errors.count };
      continue;
    }
    row += 1;
    const header = layout as HeaderLayout;
    if (split.fields.length !== header.columns.length) {
      const which = split.fields.length > header.columns.length ? 'too many' : 'too few';
      errors.add(lineNumber, null, `${which} fields: found ${split.fields.length}, the header has ${header.columns.length}`);
      continue;
    }
    const toa = readRow(split.fields, header, lineNumber, row, options, errors);
    if (toa !== null && errors.count === 0) toas.push(toa);
  }
  if (!headerSeen) {
    errors.add(1, null, `the file is empty: expected a header line naming the columns (${REQUIRED_TOA_COLUMNS.join(', ')})`);
  } else if (row === 0) {
    errors.add(headerLine, null, 'the file has a header but no data rows');
  }
  if (errors.count > 0) return { ok: false, errors: errors.listed, errorCount: errors.count };
  const header = layout as HeaderLayout;
  return { ok: true, toas, columns: header.columns, labelColumns: header.labelColumns };
}

/**
 * File errors as the lines users see: `line N, column C: message`
 * (`line N: message` when the problem is not in one column).
 */
export function formatToaFileErrors(errors: readonly ToaFileError[]): string[] {
  return errors.map((e) => (e.column === null ? `line ${e.line}: ${e.message}` : `line ${e.line}, column ${e.column}: ${e.message}`));
}

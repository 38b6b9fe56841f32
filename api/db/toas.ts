/**
 * Row type of `toas` and the lossless MJD ⇄ column conversion: an MJD is the
 * integer `mjd_day` plus `mjd_fraction` DECIMAL(39,38), written from the
 * file's own digits and read back as text (mysql2 returns DECIMAL as a string),
 * so no arrival time ever passes through a float64.
 */
import type { Knex } from 'knex';
import { escape } from 'mysql2';
import type { Mjd } from '../../worker/timing/time/epoch';
import { formatMjd } from '../../worker/timing/time/mjd-string';

export const MJD_FRACTION_DIGITS = 38; // scale of toas.mjd_fraction

export interface ToaRow {
  id: number | string; // BIGINT: mysql2 returns a string (bigNumberStrings)
  pulsar_id: number;
  batch_id: number;
  row_number: number;
  line_number: number;
  mjd_day: number;
  mjd_fraction: string; // "0.<38 digits>"
  uncertainty_us: number;
  frequency_mhz: number | null; // NULL = infinite frequency
  observatory: string;
  backend: string;
  pulse_number: number | string | null; // BIGINT
  labels: string | Record<string, string> | null;
}

export interface StoredMjd {
  day: number;
  fraction: string; // "0." followed by exactly MJD_FRACTION_DIGITS digits
}

const PLAIN_DECIMAL = /^\+?(\d+)(?:\.(\d*))?$/;

/**
 * The stored form of a non-negative plain decimal MJD text.
 *
 * @param text  e.g. `58000.1234` (optional `+`, no exponent; the reader has checked it)
 * @returns     day and the fraction with exactly 38 digits (Note 1)
 *
 * Notes: 1. Up to 38 fractional digits are kept exactly; further digits are
 *           rounded half to even at the 38th (a carry can reach the day).
 * Throws RangeError for a negative or malformed text.
 */
export function storedMjdFromText(text: string): StoredMjd {
  const match = PLAIN_DECIMAL.exec(text);
  if (match === null) throw new RangeError(`storedMjdFromText: "${text}" is not a non-negative plain decimal MJD`);
  const [, dayDigits, fractionDigits = ''] = match;
  let day = BigInt(dayDigits);
  if (fractionDigits.length <= MJD_FRACTION_DIGITS) {
    return { day: Number(day), fraction: `0.${fractionDigits.padEnd(MJD_FRACTION_DIGITS, '0')}` };
  }
  let kept = BigInt(fractionDigits.slice(0, MJD_FRACTION_DIGITS));
  const rest = fractionDigits.slice(MJD_FRACTION_DIGITS);
  const half = `5${'0'.repeat(rest.length - 1)}`;
  if (rest > half || (rest === half && kept % 2n === 1n)) kept += 1n; // equal-length digit strings compare as numbers
  const one = 10n ** BigInt(MJD_FRACTION_DIGITS);
  if (kept === one) {
    day += 1n;
    kept = 0n;
  }
  return { day: Number(day), fraction: `0.${kept.toString().padStart(MJD_FRACTION_DIGITS, '0')}` };
}

/** The stored form of an engine MJD that has no text (printed exactly at 38 digits by formatMjd). */
export function storedMjdFromMjd(mjd: Mjd): StoredMjd {
  return storedMjdFromText(formatMjd(mjd, MJD_FRACTION_DIGITS));
}

/**
 * Decimal MJD text of a stored day and DECIMAL fraction, trailing zeros of the
 * fraction dropped (`58000.5`, `58000` for a zero fraction): the same value,
 * every stored digit that matters.
 */
export function mjdTextFromStored(day: number | string, fraction: string): string {
  const digits = String(fraction).replace(/^0?\./, '').replace(/0+$/, '');
  return digits === '' ? `${day}` : `${day}.${digits}`;
}

/** One `toas` row to insert (the id is assigned by MariaDB). */
export interface ToaInsert {
  pulsar_id: number;
  batch_id: number;
  row_number: number;
  line_number: number;
  mjd_day: number;
  mjd_fraction: string; // "0.<38 digits>" from storedMjdFromText
  uncertainty_us: number;
  frequency_mhz: number | null;
  observatory: string;
  backend: string;
  pulse_number: number | null;
  labels: string | null; // JSON text
}

const INSERT_COLUMNS = `(${['pulsar_id', 'batch_id', 'row_number', 'line_number', 'mjd_day', 'mjd_fraction', 'uncertainty_us', 'frequency_mhz', 'observatory', 'backend', 'pulse_number', 'labels'].map((c) => `\`${c}\``).join(',')})`; // ROW_NUMBER is a keyword
const STORED_FRACTION = /^0\.\d{38}$/;

function sqlInteger(x: number): string {
  if (!Number.isSafeInteger(x)) throw new RangeError(`toaInsertSql: ${x} is not a safe integer`);
  return String(x);
}

function sqlDouble(x: number | null): string {
  if (x === null) return 'NULL';
  if (!Number.isFinite(x)) throw new RangeError(`toaInsertSql: ${x} is not a finite number`);
  return String(x); // shortest text that reads back to the same double
}

/**
 * The text of one multi-row INSERT of TOAs, built here: knex's query builder
 * and mysql2's placeholder formatting took most of the time for 100 000 rows
 * (scripts/bench/upload.ts). Strings are escaped with mysql2's own `escape`
 * (what its placeholder formatting uses); numbers are checked and printed;
 * the DECIMAL fraction is checked against its fixed form and sent as a
 * literal, so no digit passes through a float.
 */
export function toaInsertSql(rows: readonly ToaInsert[]): string {
  const values = new Array<string>(rows.length);
  for (let i = 0; i < rows.length; i++) {
    const r = rows[i];
    if (!STORED_FRACTION.test(r.mjd_fraction)) throw new RangeError(`toaInsertSql: fraction "${r.mjd_fraction}" is not 0.<38 digits>`);
    values[i] =
      `(${sqlInteger(r.pulsar_id)},${sqlInteger(r.batch_id)},${sqlInteger(r.row_number)},${sqlInteger(r.line_number)},` +
      `${sqlInteger(r.mjd_day)},${r.mjd_fraction},${sqlDouble(r.uncertainty_us)},${sqlDouble(r.frequency_mhz)},` +
      `${escape(r.observatory)},${escape(r.backend)},${r.pulse_number === null ? 'NULL' : sqlInteger(r.pulse_number)},${escape(r.labels)})`;
  }
  return `INSERT INTO \`toas\` ${INSERT_COLUMNS} VALUES ${values.join(',')}`;
}

/**
 * Inserts TOAs in multi-row INSERTs of `chunkRows`, building each statement's
 * text while the previous one runs (JavaScript and MariaDB work side by side).
 */
export async function insertToaRows(trx: Knex | Knex.Transaction, rows: readonly ToaInsert[], chunkRows = rows.length): Promise<void> {
  let running: Promise<unknown> | null = null;
  try {
    for (let start = 0; start < rows.length; start += chunkRows) {
      const sql = toaInsertSql(rows.slice(start, start + chunkRows));
      if (running) await running;
      running = trx.raw(sql).then((result) => result); // knex runs a query only once it is awaited
    }
    if (running) await running;
  } catch (err) {
    await running?.catch(() => undefined); // never leave a statement running (or a rejection unhandled)
    throw err;
  }
}

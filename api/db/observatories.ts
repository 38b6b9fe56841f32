/**
 * Observatories with their clock-correction points: loading, presenting,
 * replacing points. A point's MJD is stored as integer day + the fraction's
 * first 28 decimal digits (DECIMAL(30,28)), which the double-double fraction
 * of the engine's Mjd (~32 digits) fills exactly for any input of ≤ 28 digits.
 */
import type { Knex } from 'knex';
import type { Observatory } from '../../worker/timing/earth/observatory';
import type { Mjd } from '../../worker/timing/time/epoch';
import { formatMjd } from '../../worker/timing/time/mjd-string';

export const MJD_FRACTION_DIGITS = 28;

export interface ObservatoryRow {
  id: number;
  code: string;
  name: string;
  itrf_x_m: number;
  itrf_y_m: number;
  itrf_z_m: number;
}

export interface ClockCorrectionRow {
  observatory_id: number;
  mjd_day: number;
  mjd_fraction: string; // exact text: "0.25000…"
  correction_us: number;
}

/** The API's (and the file format's) JSON form of an observatory. */
export interface ObservatoryJson {
  code: string;
  name: string;
  itrf_x_m: number;
  itrf_y_m: number;
  itrf_z_m: number;
  clock_corrections: { mjd: string; correction_us: number }[];
}

/** Mjd → { mjd_day, mjd_fraction } columns (the fraction rounded to 28 digits, half-even). */
export function mjdColumns(mjd: Mjd): { mjd_day: number; mjd_fraction: string } {
  const fraction = formatMjd({ day: 0, frac: mjd.frac }, MJD_FRACTION_DIGITS); // "0.ddd…" (or "1.000…" after rounding up)
  if (fraction.startsWith('1')) return { mjd_day: mjd.day + 1, mjd_fraction: `0.${'0'.repeat(MJD_FRACTION_DIGITS)}` };
  return { mjd_day: mjd.day, mjd_fraction: fraction };
}

/** Columns → shortest decimal MJD text (trailing zeros dropped). */
export function mjdText(row: { mjd_day: number; mjd_fraction: string }): string {
  const digits = (row.mjd_fraction.split('.')[1] ?? '').replace(/0+$/, '');
  return digits ? `${row.mjd_day}.${digits}` : String(row.mjd_day);
}

function present(row: ObservatoryRow, points: ClockCorrectionRow[]): ObservatoryJson {
  return {
    code: row.code,
    name: row.name,
    itrf_x_m: row.itrf_x_m,
    itrf_y_m: row.itrf_y_m,
    itrf_z_m: row.itrf_z_m,
    clock_corrections: points.map((p) => ({ mjd: mjdText(p), correction_us: p.correction_us })),
  };
}

export async function loadObservatories(knex: Knex, code?: string): Promise<ObservatoryJson[]> {
  const query = knex<ObservatoryRow>('observatories').orderBy('code');
  const rows = (await (code === undefined ? query : query.where({ code }))) as ObservatoryRow[];
  if (rows.length === 0) return [];
  const points = (await knex<ClockCorrectionRow>('observatory_clock_corrections')
    .whereIn('observatory_id', rows.map((r) => r.id))
    .orderBy(['observatory_id', 'mjd_day', 'mjd_fraction'])) as ClockCorrectionRow[];
  return rows.map((r) => present(r, points.filter((p) => p.observatory_id === r.id)));
}

/** Position and name columns of a parsed observatory. */
export function observatoryColumns(o: Observatory): Omit<ObservatoryRow, 'id'> {
  return { code: o.code, name: o.name, itrf_x_m: o.itrfXM, itrf_y_m: o.itrfYM, itrf_z_m: o.itrfZM };
}

export async function replaceClockCorrections(knex: Knex, observatoryId: number, points: Observatory['clockCorrections']): Promise<void> {
  await knex('observatory_clock_corrections').where({ observatory_id: observatoryId }).del();
  const rows = points.map((p) => ({ observatory_id: observatoryId, ...mjdColumns(p.mjd), correction_us: p.correctionUs }));
  for (let i = 0; i < rows.length; i += 1000) await knex('observatory_clock_corrections').insert(rows.slice(i, i + 1000));
}

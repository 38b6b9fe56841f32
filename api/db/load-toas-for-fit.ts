/**
 * The arrival times a fit uses: a pulsar's included TOAs (no active
 * exclusion) as the engine's `Toa` objects, sorted by MJD, with their ids.
 */
import type { Knex } from 'knex';
import type { Toa } from '../../worker/timing/toas/toa';
import { parseMjd } from '../../worker/timing/time/mjd-string';
import { mjdTextFromStored, type ToaRow } from './toas';

export interface ToasForFit {
  toas: Toa[]; // included TOAs, sorted by MJD (then id)
  toaIds: number[]; // toas.id of each entry of `toas`, same order
  excludedIds: number[]; // ids of the pulsar's TOAs left out by an active exclusion, ascending
}

/** Labels column (JSON text from MariaDB) as a record. */
export function labelsOf(value: ToaRow['labels']): Record<string, string> {
  if (value === null) return {};
  return (typeof value === 'string' ? JSON.parse(value) : value) as Record<string, string>;
}

/**
 * Loads a pulsar's included arrival times for a fit.
 *
 * @param knex      connection or transaction
 * @param pulsarId  the pulsar
 * @returns         `{ toas, toaIds, excludedIds }` (Notes 1–3)
 *
 * Notes: 1. `mjd` is parseMjd of the stored day and exact DECIMAL fraction text,
 *           never through a float; a NULL frequency becomes Infinity.
 *        2. `row` is the 1-based position in the returned list (rows from several
 *           files would repeat the file's own row numbers); `line` is the line in
 *           the uploaded file, so an engine message still points into that file.
 *        3. A pulsar without TOAs (or unknown) gives empty arrays.
 */
export async function loadToasForFit(knex: Knex, pulsarId: number): Promise<ToasForFit> {
  const { toas, toaIds } = await loadPulsarToas(knex, pulsarId, 'included');
  const excluded = (await knex('toas')
    .where({ pulsar_id: pulsarId })
    .whereExists(activeExclusion(knex))
    .orderBy('id')
    .select('id')) as { id: number | string }[];
  return { toas, toaIds, excludedIds: excluded.map((r) => Number(r.id)) };
}

/** `toa_exclusions` rows still in force for the outer query's `toas` row. */
function activeExclusion(knex: Knex): Knex.QueryBuilder {
  return knex('toa_exclusions').select(knex.raw('1')).whereRaw('toa_exclusions.toa_id = toas.id').whereNull('restored_at');
}

/**
 * A pulsar's included or excluded TOAs as engine `Toa` objects, sorted by MJD (then id), with their ids
 * (Notes 1–2 of loadToasForFit; `row` counts within the returned list).
 */
export async function loadPulsarToas(knex: Knex, pulsarId: number, which: 'included' | 'excluded'): Promise<{ toas: Toa[]; toaIds: number[] }> {
  const query = knex('toas').where({ pulsar_id: pulsarId });
  if (which === 'included') query.whereNotExists(activeExclusion(knex));
  else query.whereExists(activeExclusion(knex));
  const rows = (await query
    .orderBy([{ column: 'mjd_day' }, { column: 'mjd_fraction' }, { column: 'id' }])
    .select(
      'id', 'line_number', 'mjd_day', 'mjd_fraction', 'uncertainty_us', 'frequency_mhz', 'observatory', 'backend', 'pulse_number', 'labels',
    )) as ToaRow[];
  const toas = rows.map((r, i): Toa => ({
    row: i + 1,
    line: r.line_number,
    mjd: parseMjd(mjdTextFromStored(r.mjd_day, r.mjd_fraction)),
    uncertaintyUs: r.uncertainty_us,
    frequencyMhz: r.frequency_mhz === null ? Infinity : r.frequency_mhz,
    observatory: r.observatory,
    backend: r.backend,
    pulseNumber: r.pulse_number === null ? null : Number(r.pulse_number),
    labels: labelsOf(r.labels),
  }));
  return { toas, toaIds: rows.map((r) => Number(r.id)) };
}

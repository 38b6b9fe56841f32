/**
 * What the explorer adds to a fit's TOA load (api/db/load-toas-for-fit.ts):
 * the TOAs left out by an active exclusion, as engine `Toa` objects, and the
 * upload (batch and 1-based data row) of every TOA of the pulsar.
 */
import type { Knex } from 'knex';
import type { Toa } from '../../worker/timing/toas/toa';
import { parseMjd } from '../../worker/timing/time/mjd-string';
import { labelsOf } from './load-toas-for-fit';
import { mjdTextFromStored, type ToaRow } from './toas';

export interface ExcludedToasForExplorer {
  toas: Toa[]; // excluded TOAs, sorted by MJD (then id); `row` counts within this list
  toaIds: number[];
}

/**
 * The pulsar's TOAs with an active exclusion, read like loadToasForFit reads the included ones.
 *
 * @param knex      connection or transaction (the same one as loadToasForFit, for one snapshot)
 * @param pulsarId  the pulsar
 */
export async function loadExcludedToas(knex: Knex, pulsarId: number): Promise<ExcludedToasForExplorer> {
  const activeExclusion = knex('toa_exclusions').select(knex.raw('1')).whereRaw('toa_exclusions.toa_id = toas.id').whereNull('restored_at');
  const rows = (await knex('toas')
    .where({ pulsar_id: pulsarId })
    .whereExists(activeExclusion)
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

/** Batch id and 1-based data row in the upload of each of the pulsar's TOAs, by TOA id. */
export async function loadToaBatchRows(knex: Knex, pulsarId: number): Promise<Map<number, { batchId: number; row: number }>> {
  const rows = (await knex('toas').where({ pulsar_id: pulsarId }).select('id', 'batch_id', 'row_number')) as Pick<ToaRow, 'id' | 'batch_id' | 'row_number'>[];
  return new Map(rows.map((r) => [Number(r.id), { batchId: Number(r.batch_id), row: Number(r.row_number) }]));
}

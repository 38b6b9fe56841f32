/**
 * What the explorer adds to a fit's TOA load (api/db/load-toas-for-fit.ts):
 * the TOAs left out by an active exclusion, as engine `Toa` objects, and the
 * upload (batch and 1-based data row) of every TOA of the pulsar.
 */
import type { Knex } from 'knex';
import type { Toa } from '../../worker/timing/toas/toa';
import { loadPulsarToas } from './load-toas-for-fit';
import type { ToaRow } from './toas';

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
  return loadPulsarToas(knex, pulsarId, 'excluded');
}

/** Batch id and 1-based data row in the upload of each of the pulsar's TOAs, by TOA id. */
export async function loadToaBatchRows(knex: Knex, pulsarId: number): Promise<Map<number, { batchId: number; row: number }>> {
  const rows = (await knex('toas').where({ pulsar_id: pulsarId }).select('id', 'batch_id', 'row_number')) as Pick<ToaRow, 'id' | 'batch_id' | 'row_number'>[];
  return new Map(rows.map((r) => [Number(r.id), { batchId: Number(r.batch_id), row: Number(r.row_number) }]));
}

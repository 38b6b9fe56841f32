/** A pulsar's stored TOAs as columns (ToaColumns), sorted by MJD, with each one's exclusion state. */
import type { Knex } from 'knex';
import type { ToaColumns } from '../../contracts/toas';
import { mjdTextFromStored, type ToaRow } from '../../db/toas';
import { notFound } from '../../errors';

export async function listToas(knex: Knex, pulsarId: number): Promise<ToaColumns> {
  const pulsar = await knex('pulsars').where({ id: pulsarId }).first('id');
  if (!pulsar) throw notFound('pulsar');
  const activeExclusion = knex('toa_exclusions').select(knex.raw('1')).whereRaw('toa_exclusions.toa_id = toas.id').whereNull('restored_at');
  const rows = (await knex('toas')
    .where({ pulsar_id: pulsarId })
    .orderBy([{ column: 'mjd_day' }, { column: 'mjd_fraction' }, { column: 'id' }])
    .select('id', 'batch_id', 'row_number', 'mjd_day', 'mjd_fraction', 'uncertainty_us', 'frequency_mhz', 'observatory', 'backend', 'pulse_number')
    .select(knex.raw('exists(?) as excluded', [activeExclusion]))) as (ToaRow & { excluded: number })[];
  const n = rows.length;
  const columns: ToaColumns = {
    count: n,
    id: new Array(n),
    batchId: new Array(n),
    row: new Array(n),
    mjd: new Array(n),
    uncertaintyUs: new Array(n),
    frequencyMhz: new Array(n),
    observatory: new Array(n),
    backend: new Array(n),
    pulseNumber: new Array(n),
    excluded: new Array(n),
  };
  rows.forEach((r, i) => {
    columns.id[i] = Number(r.id);
    columns.batchId[i] = r.batch_id;
    columns.row[i] = r.row_number;
    columns.mjd[i] = mjdTextFromStored(r.mjd_day, r.mjd_fraction);
    columns.uncertaintyUs[i] = r.uncertainty_us;
    columns.frequencyMhz[i] = r.frequency_mhz;
    columns.observatory[i] = r.observatory;
    columns.backend[i] = r.backend;
    columns.pulseNumber[i] = r.pulse_number === null ? null : Number(r.pulse_number);
    columns.excluded[i] = Number(r.excluded) === 1;
  });
  return columns;
}

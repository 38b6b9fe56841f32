/** A pulsar's TOA batches, newest first. */
import type { Knex } from 'knex';
import type { TOABatch } from '../../contracts/toas';
import { presentToaBatch, selectToaBatches, type ToaBatchRow } from '../../db/toa-batches';
import { notFound } from '../../errors';

export async function listToaBatches(knex: Knex, pulsarId: number): Promise<TOABatch[]> {
  const pulsar = await knex('pulsars').where({ id: pulsarId }).first('id');
  if (!pulsar) throw notFound('pulsar');
  const rows = (await selectToaBatches(knex).where('toa_batches.pulsar_id', pulsarId).orderBy('toa_batches.id', 'desc')) as ToaBatchRow[];
  return rows.map(presentToaBatch);
}

/**
 * Deletes a TOA batch with its TOAs (their exclusions go with them by cascade),
 * recomputes the pulsar's statistics and writes the audit row, all in one
 * transaction.
 */
import type { Knex } from 'knex';
import { recordAudit } from '../../db/audit-log';
import { notFound } from '../../errors';
import { recomputeToaStatistics } from './recompute-toa-statistics';

export async function deleteToaBatch(knex: Knex, batchId: number, userId: number): Promise<void> {
  await knex.transaction(async (trx) => {
    const batch = await trx('toa_batches').where({ id: batchId }).forUpdate().first();
    if (!batch) throw notFound('TOA batch');
    await trx('toas').where({ batch_id: batchId }).delete(); // explicit: one statement instead of a cascade per row
    await trx('toa_batches').where({ id: batchId }).delete();
    await recomputeToaStatistics(trx, batch.pulsar_id);
    await recordAudit(trx, {
      pulsarId: batch.pulsar_id,
      userId,
      action: 'toa-batch.delete',
      details: { batchId, fileName: batch.file_name, rowCount: Number(batch.row_count), checksumSha256: batch.checksum_sha256 },
    });
  });
}

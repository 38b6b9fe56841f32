/**
 * Takes TOAs back into fits: their active exclusion rows get restored_by and
 * restored_at (the rows stay as history). Audit-logged in the same transaction.
 */
import type { Knex } from 'knex';
import type { RestoreToasBody } from '../../contracts/toas';
import { recordAudit } from '../../db/audit-log';
import { checkToaIdsOfPulsar } from './exclude-toas';

export async function restoreToas(knex: Knex, pulsarId: number, body: RestoreToasBody, userId: number): Promise<{ restored: number }> {
  return knex.transaction(async (trx) => {
    const ids = await checkToaIdsOfPulsar(trx, pulsarId, body.toaIds);
    const restoredIds: number[] = [];
    for (let i = 0; i < ids.length; i += 10_000) {
      const part = ids.slice(i, i + 10_000);
      const active = trx('toa_exclusions').where({ pulsar_id: pulsarId }).whereIn('toa_id', part).whereNull('restored_at');
      const rows = await active.clone().forUpdate().select('toa_id');
      await active.clone().update({ restored_by: userId, restored_at: trx.fn.now(3) });
      for (const r of rows) restoredIds.push(Number(r.toa_id));
    }
    if (restoredIds.length > 0) {
      await recordAudit(trx, { pulsarId, userId, action: 'toas.restore', details: { toaIds: restoredIds, count: restoredIds.length } });
    }
    return { restored: restoredIds.length };
  });
}

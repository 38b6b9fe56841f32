/**
 * Leaves TOAs of a pulsar out of fits, with a reason; TOAs already excluded
 * are skipped. Every id must be a TOA of this pulsar. Audit-logged in the same
 * transaction.
 */
import type { Knex } from 'knex';
import type { ExcludeToasBody } from '../../contracts/toas';
import { recordAudit } from '../../db/audit-log';
import { fieldError, notFound } from '../../errors';

/** Checks that every id is a TOA of the pulsar (400 naming the first strangers otherwise). */
export async function checkToaIdsOfPulsar(trx: Knex.Transaction, pulsarId: number, toaIds: number[]): Promise<number[]> {
  const pulsar = await trx('pulsars').where({ id: pulsarId }).first('id');
  if (!pulsar) throw notFound('pulsar');
  const unique = [...new Set(toaIds)];
  const found = new Set<number>();
  for (let i = 0; i < unique.length; i += 10_000) {
    const part = unique.slice(i, i + 10_000);
    for (const r of await trx('toas').where({ pulsar_id: pulsarId }).whereIn('id', part).select('id')) found.add(Number(r.id));
  }
  const strangers = unique.filter((id) => !found.has(id));
  if (strangers.length > 0) {
    const shown = strangers.slice(0, 5).join(', ');
    throw fieldError(['toaIds'], `${strangers.length} id(s) are not TOAs of this pulsar: ${shown}${strangers.length > 5 ? ', …' : ''}`);
  }
  return unique;
}

export async function excludeToas(knex: Knex, pulsarId: number, body: ExcludeToasBody, userId: number): Promise<{ excluded: number }> {
  return knex.transaction(async (trx) => {
    const ids = await checkToaIdsOfPulsar(trx, pulsarId, body.toaIds);
    const already = new Set<number>();
    for (let i = 0; i < ids.length; i += 10_000) {
      const part = ids.slice(i, i + 10_000);
      const rows = await trx('toa_exclusions').whereIn('toa_id', part).whereNull('restored_at').forUpdate().select('toa_id');
      for (const r of rows) already.add(Number(r.toa_id));
    }
    const fresh = ids.filter((id) => !already.has(id));
    for (let i = 0; i < fresh.length; i += 5_000) {
      const rows = fresh.slice(i, i + 5_000).map((toaId) => ({ toa_id: toaId, pulsar_id: pulsarId, reason: body.reason, excluded_by: userId }));
      await trx('toa_exclusions').insert(rows);
    }
    if (fresh.length > 0) {
      await recordAudit(trx, { pulsarId, userId, action: 'toas.exclude', details: { toaIds: fresh, reason: body.reason, count: fresh.length } });
    }
    return { excluded: fresh.length };
  });
}

/**
 * Changes an observatory's name, position or clock corrections (a given list
 * replaces the old one). The patch is laid over the stored observatory and the
 * result parsed with the same schema as a new one, so every rule still holds.
 */
import type { Knex } from 'knex';
import { observatoryColumns, replaceClockCorrections, type ObservatoryJson } from '../../db/observatories';
import { detailsFromIssues, notFound, validationError } from '../../errors';
import { CreateObservatoryBody, type UpdateObservatoryBody } from '../../routes/observatories/schema';
import { getObservatory } from './get-observatory';

export async function updateObservatory(knex: Knex, code: string, patch: UpdateObservatoryBody): Promise<ObservatoryJson> {
  await knex.transaction(async (trx) => {
    const row = await trx('observatories').where({ code }).forUpdate().first('id');
    if (!row) throw notFound('observatory');
    const stored = await getObservatory(trx, code);
    const defined = Object.fromEntries(Object.entries(patch).filter(([, v]) => v !== undefined));
    const parsed = CreateObservatoryBody.safeParse({ ...stored, ...defined });
    if (!parsed.success) throw validationError(detailsFromIssues(parsed.error.issues));
    await trx('observatories').where({ id: row.id }).update({ ...observatoryColumns(parsed.data), updated_at: new Date() });
    if (patch.clock_corrections !== undefined) await replaceClockCorrections(trx, row.id, parsed.data.clockCorrections);
  });
  return getObservatory(knex, code);
}

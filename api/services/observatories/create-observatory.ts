/** Registers an observatory (already parsed by the engine's schema); 409 if the code exists. */
import type { Knex } from 'knex';
import type { Observatory } from '../../../worker/timing/earth/observatory';
import { observatoryColumns, replaceClockCorrections, type ObservatoryJson } from '../../db/observatories';
import { conflict } from '../../errors';
import { getObservatory } from './get-observatory';

export async function createObservatory(knex: Knex, observatory: Observatory): Promise<ObservatoryJson> {
  await knex.transaction(async (trx) => {
    if (await trx('observatories').where({ code: observatory.code }).first('id')) throw conflict(`observatory ${observatory.code} exists`);
    const [id] = await trx('observatories').insert(observatoryColumns(observatory));
    await replaceClockCorrections(trx, id, observatory.clockCorrections);
  });
  return getObservatory(knex, observatory.code);
}

/** Removes an observatory and its clock corrections; 404 if unknown. */
import type { Knex } from 'knex';
import { notFound } from '../../errors';

export async function deleteObservatory(knex: Knex, code: string): Promise<void> {
  const deleted = await knex('observatories').where({ code }).del();
  if (deleted === 0) throw notFound('observatory');
}

/** One pulsar by id, or 404. */
import type { Knex } from 'knex';
import { presentPulsar, type Pulsar, type PulsarRow } from '../../db/pulsars';
import { notFound } from '../../errors';

export async function getPulsar(knex: Knex, id: number): Promise<Pulsar> {
  const row = (await knex<PulsarRow>('pulsars').where({ id }).first()) as PulsarRow | undefined;
  if (!row) throw notFound('pulsar');
  return presentPulsar(row);
}

/** Every pulsar with its TOA statistics, by name (the dashboard). */
import type { Knex } from 'knex';
import { presentPulsar, type Pulsar, type PulsarRow } from '../../db/pulsars';

export async function listPulsars(knex: Knex): Promise<Pulsar[]> {
  const rows = (await knex<PulsarRow>('pulsars').orderBy('name')) as PulsarRow[];
  return rows.map(presentPulsar);
}

/** Adds a pulsar (no TOAs yet); 409 if the name is taken. */
import type { Knex } from 'knex';
import type { CreatePulsarBody } from '../../contracts/pulsar';
import type { Pulsar } from '../../db/pulsars';
import { conflict } from '../../errors';
import { getPulsar } from './get-pulsar';

export async function createPulsar(knex: Knex, input: CreatePulsarBody, createdBy: number): Promise<Pulsar> {
  try {
    const [id] = await knex('pulsars').insert({ name: input.name, ra_hms: input.raHms, dec_dms: input.decDms, created_by: createdBy });
    return await getPulsar(knex, id);
  } catch (err) {
    if ((err as { code?: string }).code === 'ER_DUP_ENTRY') throw conflict(`a pulsar named ${input.name} exists`);
    throw err;
  }
}

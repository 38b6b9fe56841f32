/** A pulsar's model revisions, newest first (404 for an unknown pulsar). */
import type { Knex } from 'knex';
import { presentRevisions, type Revision, type RevisionRow } from '../../db/revisions';
import { notFound } from '../../errors';

export async function listRevisions(knex: Knex, pulsarId: number): Promise<Revision[]> {
  const pulsar = await knex('pulsars').where({ id: pulsarId }).first('id');
  if (!pulsar) throw notFound('pulsar');
  const rows = (await knex('model_revisions').where({ pulsar_id: pulsarId }).orderBy('id', 'desc')) as RevisionRow[];
  return presentRevisions(knex, rows);
}

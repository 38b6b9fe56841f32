/** One revision with its model, or 404. */
import type { Knex } from 'knex';
import { findRevision, presentRevisionWithModel, type RevisionWithModel } from '../../db/revisions';
import { notFound } from '../../errors';

export async function getRevision(knex: Knex, id: number): Promise<RevisionWithModel> {
  const row = await findRevision(knex, id);
  if (!row) throw notFound('revision');
  return presentRevisionWithModel(knex, row);
}

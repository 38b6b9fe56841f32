/**
 * Marks a revision released (lead and up), audit-logged in the same
 * transaction. Only the release columns change; the revision stays immutable.
 */
import type { Knex } from 'knex';
import { recordAudit } from '../../db/audit-log';
import { presentRevisions, setRevisionRelease, type Revision, type RevisionRow } from '../../db/revisions';
import { conflict, notFound } from '../../errors';

/** Throws 404 for an unknown revision, 409 when it is already released. */
export async function releaseRevision(knex: Knex, id: number, userId: number, note: string): Promise<Revision> {
  const row = await knex.transaction(async (trx) => {
    const current = (await trx('model_revisions').where({ id }).forUpdate().first()) as RevisionRow | undefined;
    if (!current) throw notFound('revision');
    if (current.released_at !== null) throw conflict('this revision is already released');
    await setRevisionRelease(trx, id, { releasedAt: new Date(), releasedBy: userId, releaseNote: note });
    await recordAudit(trx, { pulsarId: current.pulsar_id, userId, action: 'revision.release', details: { revisionId: id, note } });
    return (await trx('model_revisions').where({ id }).first()) as RevisionRow;
  });
  const [revision] = await presentRevisions(knex, [row]);
  return revision;
}

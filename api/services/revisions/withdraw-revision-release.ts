/** Withdraws a revision's release (lead and up), audit-logged; the revision itself is unchanged. */
import type { Knex } from 'knex';
import { recordAudit } from '../../db/audit-log';
import { presentRevisions, setRevisionRelease, type Revision, type RevisionRow } from '../../db/revisions';
import { conflict, notFound } from '../../errors';

/** Throws 404 for an unknown revision, 409 when it is not released. */
export async function withdrawRevisionRelease(knex: Knex, id: number, userId: number): Promise<Revision> {
  const row = await knex.transaction(async (trx) => {
    const current = (await trx('model_revisions').where({ id }).forUpdate().first()) as RevisionRow | undefined;
    if (!current) throw notFound('revision');
    if (current.released_at === null) throw conflict('this revision is not released');
    await setRevisionRelease(trx, id, null);
    await recordAudit(trx, {
      pulsarId: current.pulsar_id,
      userId,
      action: 'revision.withdraw-release',
      details: { revisionId: id, previousNote: current.release_note, releasedBy: current.released_by },
    });
    return (await trx('model_revisions').where({ id }).first()) as RevisionRow;
  });
  const [revision] = await presentRevisions(knex, [row]);
  return revision;
}

/**
 * Saves the resulting model of a finished search run as a new model revision
 * of its pulsar (parent: the searched revision), in one step, and remembers it
 * on the run. The model goes through the same checks as any revision
 * (api/services/revisions/create-revision.ts).
 */
import type { Knex } from 'knex';
import type { SearchResult } from '../../contracts/search-runs';
import type { RevisionWithModel } from '../../db/revisions';
import type { SearchRunRow } from '../../db/search-runs';
import { conflict, notFound } from '../../errors';
import { createRevision } from '../revisions/create-revision';

/**
 * @param searchRunId  the run
 * @param authorId     the signed-in analyst
 * @param message      the revision's message (1–500 characters, checked by the route)
 * @returns            the new revision with its model
 * Throws 404 for an unknown run; 409 `conflict` when the run has not succeeded,
 * found no companion, or was already saved (the message names that revision).
 */
export async function saveSearchRevision(knex: Knex, searchRunId: number, authorId: number, message: string): Promise<RevisionWithModel> {
  return knex.transaction(async (trx) => {
    // Row lock: two saves of one run cannot both pass the saved_revision_id check.
    const current = (await trx('search_runs').where({ id: searchRunId }).forUpdate().first()) as SearchRunRow | undefined;
    if (!current) throw notFound('search run');
    if (current.status !== 'succeeded' || current.result_json === null) {
      throw conflict(`search run ${searchRunId} has not finished (status ${current.status}); nothing to save`);
    }
    if (current.saved_revision_id !== null) throw conflict(`search run ${searchRunId} was already saved as revision ${current.saved_revision_id}`);
    const result = JSON.parse(current.result_json) as SearchResult;
    if (result.companionsFound === 0) throw conflict(`search run ${searchRunId} found no new companion; the model is unchanged`);
    const revision = await createRevision(trx as unknown as Knex, current.pulsar_id, authorId, {
      model: result.resultingModel,
      message,
      parentId: current.revision_id,
    });
    await trx('search_runs').where({ id: searchRunId }).update({ saved_revision_id: revision.id });
    return revision;
  });
}

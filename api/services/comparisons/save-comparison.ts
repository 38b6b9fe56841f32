/**
 * Saves a comparison (its runs and a comment; lead and up), audit-logged
 * (`comparison.save`) in the same transaction. The runs are checked first, so
 * nothing is stored for a comparison that could not be computed.
 */
import type { Knex } from 'knex';
import type { SaveComparisonBody, SavedComparisonWithResult } from '../../contracts/comparisons';
import { recordAudit } from '../../db/audit-log';
import { findComparison, insertComparison, presentComparisons } from '../../db/comparisons';
import { getFitComparison } from './get-fit-comparison';

/** Throws 404 for an unknown pulsar; 400 (path fitRunIds) for runs of another pulsar or runs that have not succeeded. */
export async function saveComparison(knex: Knex, pulsarId: number, userId: number, body: SaveComparisonBody): Promise<SavedComparisonWithResult> {
  const comparison = await getFitComparison(knex, pulsarId, body.fitRunIds, ['fitRunIds']);
  const id = await knex.transaction(async (trx) => {
    const newId = await insertComparison(trx, { pulsarId, fitRunIds: body.fitRunIds, comment: body.comment, createdBy: userId });
    await recordAudit(trx, { pulsarId, userId, action: 'comparison.save', details: { comparisonId: newId, fitRunIds: body.fitRunIds, comment: body.comment } });
    return newId;
  });
  const row = await findComparison(knex, id);
  if (!row) throw new Error(`comparison ${id} vanished after insert`);
  const [saved] = await presentComparisons(knex, [row]);
  return { ...saved, comparison };
}

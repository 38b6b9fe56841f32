/** One saved comparison with its comparison recomputed from the runs' stored results (the linkable view). */
import type { Knex } from 'knex';
import type { SavedComparisonWithResult } from '../../contracts/comparisons';
import { findComparison, presentComparisons } from '../../db/comparisons';
import { AppError, notFound } from '../../errors';
import { getFitComparison } from './get-fit-comparison';

/** Throws 404 for an unknown comparison; 409 `comparison_unavailable` if its runs can no longer be compared. */
export async function getSavedComparison(knex: Knex, id: number): Promise<SavedComparisonWithResult> {
  const row = await findComparison(knex, id);
  if (!row) throw notFound('comparison');
  const [saved] = await presentComparisons(knex, [row]);
  try {
    return { ...saved, comparison: await getFitComparison(knex, saved.pulsarId, saved.fitRunIds, ['fitRunIds']) };
  } catch (error) {
    if (error instanceof AppError && error.status === 400) {
      throw new AppError(409, 'comparison_unavailable', `this saved comparison can no longer be computed: ${error.message}`);
    }
    throw error;
  }
}

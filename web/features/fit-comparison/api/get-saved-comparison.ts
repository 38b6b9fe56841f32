import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SavedComparisonWithResult } from '../../../../api/contracts/comparisons';
import { api } from '../../../lib/api-client';
import { comparisonKeys } from './get-fit-comparison';

export type { SavedComparisonWithResult };

/** GET /api/comparisons/:id: the saved comparison, recomputed from the stored results (409 `comparison_unavailable` when it cannot be). */
export const getSavedComparison = (comparisonId: string) =>
  api.get<SavedComparisonWithResult>(`/comparisons/${encodeURIComponent(comparisonId)}`);

export const savedComparisonQueryOptions = (comparisonId: string) =>
  queryOptions({ queryKey: comparisonKeys.saved(comparisonId), queryFn: () => getSavedComparison(comparisonId) });

export const useSavedComparison = (comparisonId: string) => useQuery(savedComparisonQueryOptions(comparisonId));

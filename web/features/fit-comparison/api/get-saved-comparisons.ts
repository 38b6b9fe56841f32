import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SavedComparison } from '../../../../api/contracts/comparisons';
import { api } from '../../../lib/api-client';
import { comparisonKeys } from './get-fit-comparison';

export type { SavedComparison };

/** GET /api/pulsars/:id/comparisons: newest first. */
export const getSavedComparisons = (pulsarId: string) =>
  api.get<SavedComparison[]>(`/pulsars/${encodeURIComponent(pulsarId)}/comparisons`);

export const savedComparisonsQueryOptions = (pulsarId: string) =>
  queryOptions({ queryKey: comparisonKeys.savedOfPulsar(pulsarId), queryFn: () => getSavedComparisons(pulsarId) });

export const useSavedComparisons = (pulsarId: string) => useQuery(savedComparisonsQueryOptions(pulsarId));

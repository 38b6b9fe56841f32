import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { FitComparison } from '../../../../api/contracts/comparisons';
import { api } from '../../../lib/api-client';

export type { FitComparison };

export const comparisonKeys = {
  all: ['fit-comparisons'] as const,
  /** the comparison computed on demand; `fitRunIds` reference first */
  computed: (pulsarId: string, fitRunIds: readonly number[]) => ['fit-comparisons', 'computed', pulsarId, fitRunIds.join(',')] as const,
  savedOfPulsar: (pulsarId: string) => ['fit-comparisons', 'saved', 'pulsar', pulsarId] as const,
  saved: (comparisonId: string) => ['fit-comparisons', 'saved', 'detail', comparisonId] as const,
};

/** GET /api/pulsars/:id/fit-comparison?runs=…: the first id is the reference run (docs/api.md, "Fit comparisons"). */
export const getFitComparison = (pulsarId: string, fitRunIds: readonly number[]) =>
  api.get<FitComparison>(`/pulsars/${encodeURIComponent(pulsarId)}/fit-comparison?runs=${fitRunIds.join(',')}`);

export const fitComparisonQueryOptions = (pulsarId: string, fitRunIds: readonly number[]) =>
  queryOptions({
    queryKey: comparisonKeys.computed(pulsarId, fitRunIds),
    queryFn: () => getFitComparison(pulsarId, fitRunIds),
  });

/** Keeps the previous table on screen while a changed choice of runs loads. */
export const useFitComparison = (pulsarId: string, fitRunIds: readonly number[]) =>
  useQuery({ ...fitComparisonQueryOptions(pulsarId, fitRunIds), placeholderData: keepPreviousData, enabled: fitRunIds.length >= 2 });

import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ExplorerTable } from '../../../../api/contracts/explorer';
import { api, isApiError } from '../../../lib/api-client';

/** GET /api/fit-runs/:id/explorer, columnar (api/contracts/explorer.ts). */
export type ExplorerData = ExplorerTable;

export const explorerKeys = {
  all: ['explorer'] as const,
  ofFitRun: (fitRunId: string) => ['explorer', 'fit-run', fitRunId] as const,
};

export const getExplorerData = (fitRunId: string) => api.get<ExplorerData>(`/fit-runs/${encodeURIComponent(fitRunId)}/explorer`);

// A finished run's explorer table never changes; a 404 (no table stored) is final too.
export const explorerQueryOptions = (fitRunId: string) =>
  queryOptions({
    queryKey: explorerKeys.ofFitRun(fitRunId),
    queryFn: () => getExplorerData(fitRunId),
    staleTime: Infinity,
    retry: (failures, error) => !(isApiError(error) && error.status >= 400 && error.status < 500) && failures < 2,
  });

export const useExplorerData = (fitRunId: string | null) => useQuery({ ...explorerQueryOptions(fitRunId ?? ''), enabled: fitRunId !== null });

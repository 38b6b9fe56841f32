import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ResidualTable } from '../../../../api/contracts/fit-runs';
import { api } from '../../../lib/api-client';

/** GET /api/fit-runs/:id/residuals, columnar: index i across all arrays is one TOA (api/contracts/fit-runs.ts). */
export type ResidualColumns = ResidualTable;

export const residualKeys = {
  all: ['residuals'] as const,
  ofFitRun: (fitRunId: string) => ['residuals', 'fit-run', fitRunId] as const,
};

export const getResiduals = (fitRunId: string) => api.get<ResidualColumns>(`/fit-runs/${encodeURIComponent(fitRunId)}/residuals`);

// A finished run's residuals never change.
export const residualsQueryOptions = (fitRunId: string) =>
  queryOptions({ queryKey: residualKeys.ofFitRun(fitRunId), queryFn: () => getResiduals(fitRunId), staleTime: Infinity });

export const useResiduals = (fitRunId: string) => useQuery(residualsQueryOptions(fitRunId));

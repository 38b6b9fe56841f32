import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export interface ClockCorrection {
  /** A decimal MJD; the API accepts and prefers a string so that every digit survives. */
  mjd: string | number;
  correction_us: number;
}
export interface Observatory {
  code: string;
  name: string;
  itrf_x_m: number;
  itrf_y_m: number;
  itrf_z_m: number;
  clock_corrections: ClockCorrection[];
}

export const observatoryKeys = {
  all: ['observatories'] as const,
  list: () => ['observatories', 'list'] as const,
  detail: (code: string) => ['observatories', 'detail', code] as const,
};

export const getObservatories = () => api.get<Observatory[]>('/observatories');

export const observatoriesQueryOptions = () => queryOptions({ queryKey: observatoryKeys.list(), queryFn: getObservatories });

export const useObservatories = () => useQuery(observatoriesQueryOptions());

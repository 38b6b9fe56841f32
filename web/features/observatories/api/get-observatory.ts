import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { observatoryKeys, type Observatory } from './get-observatories';

export const getObservatory = (code: string) => api.get<Observatory>(`/observatories/${encodeURIComponent(code)}`);

export const observatoryQueryOptions = (code: string) =>
  queryOptions({ queryKey: observatoryKeys.detail(code), queryFn: () => getObservatory(code) });

export const useObservatory = (code: string) => useQuery(observatoryQueryOptions(code));

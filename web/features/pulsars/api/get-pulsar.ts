import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { pulsarKeys, type Pulsar } from './get-pulsars';

export const getPulsar = (id: string) => api.get<Pulsar>(`/pulsars/${encodeURIComponent(id)}`);

export const pulsarQueryOptions = (id: string) => queryOptions({ queryKey: pulsarKeys.detail(id), queryFn: () => getPulsar(id) });

export const usePulsar = (id: string) => useQuery(pulsarQueryOptions(id));

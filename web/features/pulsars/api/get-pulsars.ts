import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

/** The newest fit of a pulsar as the pulsar list carries it (docs/api-workflow.md, "Pulsars list additions"). */
export interface LatestFit {
  id: number;
  status: 'queued' | 'running' | 'succeeded' | 'failed' | 'cancelled';
  reducedChi2: number | null;
  weightedRmsUs: number | null;
  finishedAt: string | null;
}

export interface Pulsar {
  id: string | number;
  name: string;
  raHms: string;
  decDms: string;
  toaCount: number;
  firstMjd: number | string | null;
  lastMjd: number | string | null;
  observatories: string[];
  createdAt: string;
  /** When the toa-statistics job last wrote the counts; null before its first run. */
  statisticsUpdatedAt?: string | null;
  /** Absent from servers older than the data-workflow issue. */
  latestFit?: LatestFit | null;
  revisionCount?: number;
}

export const pulsarKeys = {
  all: ['pulsars'] as const,
  list: () => ['pulsars', 'list'] as const,
  detail: (id: string) => ['pulsars', 'detail', id] as const,
};

export const getPulsars = () => api.get<Pulsar[]>('/pulsars');

export const pulsarsQueryOptions = () => queryOptions({ queryKey: pulsarKeys.list(), queryFn: getPulsars });

export const usePulsars = () => useQuery(pulsarsQueryOptions());

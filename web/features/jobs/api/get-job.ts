import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export interface Job {
  id: string;
  name: string;
  state: string;
  progress: { percent: number; stage: string } | null;
  result: unknown;
  failedReason: string | null;
}

/** States after which a job never changes again; polling stops there. */
export const FINAL_JOB_STATES: ReadonlySet<string> = new Set(['completed', 'failed']);

export const JOB_POLL_INTERVAL_MS = 1000;

export const jobKeys = {
  all: ['jobs'] as const,
  detail: (id: string) => ['jobs', 'detail', id] as const,
};

export const getJob = (id: string) => api.get<Job>(`/jobs/${encodeURIComponent(id)}`);

export const jobQueryOptions = (id: string) =>
  queryOptions({
    queryKey: jobKeys.detail(id),
    queryFn: () => getJob(id),
    refetchInterval: (query) => (query.state.data && FINAL_JOB_STATES.has(query.state.data.state) ? false : JOB_POLL_INTERVAL_MS),
  });

export const useJob = (id: string | null) => useQuery({ ...jobQueryOptions(id ?? ''), enabled: id !== null });

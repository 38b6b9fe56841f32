import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

/** Queues the `toa-statistics` job for one pulsar; the API answers 202 with the job's id. */
export const startStatisticsJob = (pulsarId: string) =>
  api.post<{ jobId: string }>(`/pulsars/${encodeURIComponent(pulsarId)}/statistics-jobs`);

export const useStartStatisticsJob = (pulsarId: string) => useMutation({ mutationFn: () => startStatisticsJob(pulsarId) });

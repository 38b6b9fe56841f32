import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, isApiError } from '../../../lib/api-client';

export type CampaignStatus = 'queued' | 'running' | 'succeeded' | 'failed' | 'cancelled';
export type RunStatus = 'queued' | 'running' | 'succeeded' | 'failed' | 'cancelled' | string;

export interface FitFigures {
  reducedChi2: number | null;
  weightedRmsUs: number | null;
}

/** A batch reprocessing campaign (docs/api-workflow.md, "Campaigns"). */
export interface Campaign {
  id: number;
  name: string;
  createdBy: { id: number | string; displayName: string } | number | string | null;
  revisionChoice: 'latest' | 'released';
  status: CampaignStatus;
  progress: { percent: number; stage: string; done: number; total: number };
  createdAt: string;
  finishedAt: string | null;
  runs: { pulsarId: number; pulsarName: string; revisionId: number | null; fitRunId: number | null; status: RunStatus; skippedReason: string | null }[];
  summary: { pulsarId: number; pulsarName: string; before: FitFigures | null; after: FitFigures | null; status: RunStatus }[] | null;
}

/** States after which a campaign never changes; polling stops there. */
export const FINAL_CAMPAIGN_STATUSES: ReadonlySet<string> = new Set(['succeeded', 'failed', 'cancelled']);
export const CAMPAIGN_POLL_INTERVAL_MS = 1000;

export const campaignKeys = {
  all: ['campaigns'] as const,
  list: () => ['campaigns', 'list'] as const,
  detail: (id: string) => ['campaigns', 'detail', id] as const,
};

export const getCampaigns = () => api.get<Campaign[]>('/campaigns');
export const getCampaign = (id: string) => api.get<Campaign>(`/campaigns/${encodeURIComponent(id)}`);

// The list polls (more slowly) while any campaign on it is still working.
export const campaignsQueryOptions = () =>
  queryOptions({
    queryKey: campaignKeys.list(),
    queryFn: getCampaigns,
    refetchInterval: (query) => (query.state.data?.some((c) => !FINAL_CAMPAIGN_STATUSES.has(c.status)) ? 3 * CAMPAIGN_POLL_INTERVAL_MS : false),
  });

/** Polls until the campaign is final; a client error (403, 404) stops polling too, as asking again cannot help. */
export const campaignQueryOptions = (id: string) =>
  queryOptions({
    queryKey: campaignKeys.detail(id),
    queryFn: () => getCampaign(id),
    refetchInterval: (query) => {
      const { data, error } = query.state;
      if (data && FINAL_CAMPAIGN_STATUSES.has(data.status)) return false;
      if (isApiError(error) && error.status >= 400 && error.status < 500) return false;
      return CAMPAIGN_POLL_INTERVAL_MS;
    },
  });

export const useCampaigns = () => useQuery(campaignsQueryOptions());
export const useCampaign = (id: string, enabled = true) => useQuery({ ...campaignQueryOptions(id), enabled });

import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { campaignKeys, type Campaign } from './get-campaigns';

export interface CreateCampaignBody {
  name: string;
  pulsarIds: number[] | 'all';
  revisionChoice: 'latest' | 'released';
  notifyMe?: boolean;
}

/** POST /api/campaigns → 202 the queued campaign. */
export const createCampaign = (body: CreateCampaignBody) => api.post<Campaign>('/campaigns', body);

export function useCreateCampaign() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createCampaign,
    onSuccess: (campaign) => {
      queryClient.setQueryData(campaignKeys.detail(String(campaign.id)), campaign);
      return queryClient.invalidateQueries({ queryKey: campaignKeys.list() });
    },
  });
}

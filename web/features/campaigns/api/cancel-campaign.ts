import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { campaignKeys, type Campaign } from './get-campaigns';

/** POST /api/campaigns/:id/cancel → the campaign, now cancelled. */
export const cancelCampaign = (id: string) => api.post<Campaign>(`/campaigns/${encodeURIComponent(id)}/cancel`);

export function useCancelCampaign(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => cancelCampaign(id),
    onSuccess: (campaign) => {
      queryClient.setQueryData(campaignKeys.detail(id), campaign);
      return queryClient.invalidateQueries({ queryKey: campaignKeys.all });
    },
  });
}

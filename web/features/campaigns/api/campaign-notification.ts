import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

/** The caller's e-mail subscriptions (GET /api/notifications). */
export interface Subscriptions {
  pulsarIds: number[];
  campaignIds: number[];
}

// Same key as the pulsar page's subscriptions: one endpoint, one cache entry.
export const subscriptionKeys = {
  all: ['notifications'] as const,
  mine: () => ['notifications', 'mine'] as const,
};

export const getSubscriptions = () => api.get<Subscriptions>('/notifications');
export const subscriptionsQueryOptions = () => queryOptions({ queryKey: subscriptionKeys.mine(), queryFn: getSubscriptions });
export const useSubscriptions = () => useQuery(subscriptionsQueryOptions());

/** PUT /api/campaigns/:id/notification `{ subscribed }` → `{ subscribed }`. */
export const setCampaignNotification = (campaignId: number, subscribed: boolean) =>
  api.put<{ subscribed: boolean }>(`/campaigns/${encodeURIComponent(String(campaignId))}/notification`, { subscribed });

export function useSetCampaignNotification(campaignId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (subscribed: boolean) => setCampaignNotification(campaignId, subscribed),
    onSuccess: ({ subscribed }) => {
      queryClient.setQueryData<Subscriptions>(subscriptionKeys.mine(), (old) =>
        old
          ? { ...old, campaignIds: subscribed ? [...new Set([...old.campaignIds, campaignId])] : old.campaignIds.filter((id) => id !== campaignId) }
          : old,
      );
      return queryClient.invalidateQueries({ queryKey: subscriptionKeys.all });
    },
  });
}

import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

/** The caller's e-mail subscriptions (GET /api/notifications). */
export interface NotificationSubscriptions {
  pulsarIds: number[];
  campaignIds: number[];
}

export const notificationKeys = {
  all: ['notifications'] as const,
  mine: () => ['notifications', 'mine'] as const,
};

export const getNotifications = () => api.get<NotificationSubscriptions>('/notifications');

export const notificationsQueryOptions = () => queryOptions({ queryKey: notificationKeys.mine(), queryFn: getNotifications });

export const useNotifications = () => useQuery(notificationsQueryOptions());

/** PUT /api/pulsars/:id/notification `{ subscribed }` → `{ subscribed }`: e-mails about this pulsar's fits. */
export const setPulsarNotification = (pulsarId: string, subscribed: boolean) =>
  api.put<{ subscribed: boolean }>(`/pulsars/${encodeURIComponent(pulsarId)}/notification`, { subscribed });

/** PUT /api/campaigns/:id/notification `{ subscribed }` → `{ subscribed }`: an e-mail when the campaign finishes. */
export const setCampaignNotification = (campaignId: number, subscribed: boolean) =>
  api.put<{ subscribed: boolean }>(`/campaigns/${encodeURIComponent(String(campaignId))}/notification`, { subscribed });

/** The subscriptions with `id` added to or removed from one list. */
function withSubscription(old: NotificationSubscriptions, list: keyof NotificationSubscriptions, id: number, subscribed: boolean): NotificationSubscriptions {
  return { ...old, [list]: subscribed ? [...new Set([...old[list], id])] : old[list].filter((x) => x !== id) };
}

/**
 * One opt-in/opt-out mutation: on success the cached subscriptions take the server's answer at once,
 * then are fetched again.
 */
function useSetNotification(list: keyof NotificationSubscriptions, id: number, put: (subscribed: boolean) => Promise<{ subscribed: boolean }>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: put,
    onSuccess: ({ subscribed }) => {
      queryClient.setQueryData<NotificationSubscriptions>(notificationKeys.mine(), (old) => (old ? withSubscription(old, list, id, subscribed) : old));
      return queryClient.invalidateQueries({ queryKey: notificationKeys.all });
    },
  });
}

export const useSetPulsarNotification = (pulsarId: string) =>
  useSetNotification('pulsarIds', Number(pulsarId), (subscribed) => setPulsarNotification(pulsarId, subscribed));

export const useSetCampaignNotification = (campaignId: number) =>
  useSetNotification('campaignIds', campaignId, (subscribed) => setCampaignNotification(campaignId, subscribed));

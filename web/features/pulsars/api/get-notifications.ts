import { queryOptions, useQuery } from '@tanstack/react-query';
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

import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { notificationKeys } from './get-notifications';

/** Opts the caller in or out of e-mails about this pulsar's fits (PUT /api/pulsars/:id/notification). */
export const setPulsarNotification = (pulsarId: string, subscribed: boolean) =>
  api.put<{ subscribed: boolean }>(`/pulsars/${encodeURIComponent(pulsarId)}/notification`, { subscribed });

export function useSetPulsarNotification(pulsarId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (subscribed: boolean) => setPulsarNotification(pulsarId, subscribed),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: notificationKeys.all }),
  });
}

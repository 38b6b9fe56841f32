import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { SessionUser } from '../../auth/api/get-me';

export interface AcceptInvitationBody {
  displayName: string;
  password: string;
}

// Signs the new user in: the client drops its CSRF token afterwards (lib/api-client.ts).
export const acceptInvitation = (token: string, body: AcceptInvitationBody) =>
  api.post<{ user: SessionUser }>(`/invitations/${encodeURIComponent(token)}/accept`, body);

export function useAcceptInvitation(token: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: AcceptInvitationBody) => acceptInvitation(token, body),
    onSuccess: () => queryClient.clear(),
  });
}

import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export interface Invitation {
  email: string;
  role: string;
}

export const invitationKeys = {
  all: ['invitations'] as const,
  detail: (token: string) => ['invitations', 'detail', token] as const,
};

export const getInvitation = (token: string) => api.get<Invitation>(`/invitations/${encodeURIComponent(token)}`);

export const invitationQueryOptions = (token: string) =>
  queryOptions({ queryKey: invitationKeys.detail(token), queryFn: () => getInvitation(token), retry: false });

export const useInvitation = (token: string) => useQuery(invitationQueryOptions(token));

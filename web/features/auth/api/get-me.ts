import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export interface SessionUser {
  id: number | string;
  email: string;
  displayName: string;
  role: string;
}
export interface Me {
  user: SessionUser;
  permissions: string[];
}

export const authKeys = {
  all: ['auth'] as const,
  me: () => ['auth', 'me'] as const,
};

export const getMe = () => api.get<Me>('/auth/me');

export const meQueryOptions = () =>
  queryOptions({ queryKey: authKeys.me(), queryFn: getMe, staleTime: 60_000, retry: false });

export const useMe = () => useQuery(meQueryOptions());

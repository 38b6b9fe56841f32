import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export interface User {
  id: number | string;
  email: string;
  displayName: string;
  role: string;
  active: boolean;
  createdAt: string;
}

export const userKeys = {
  all: ['users'] as const,
  list: () => ['users', 'list'] as const,
};

export const getUsers = () => api.get<User[]>('/users');

export const usersQueryOptions = () => queryOptions({ queryKey: userKeys.list(), queryFn: getUsers });

export const useUsers = () => useQuery(usersQueryOptions());

import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { userKeys, type User } from './get-users';

export interface UserPatch {
  role?: string;
  active?: boolean;
}

export const updateUser = (id: number | string, patch: UserPatch) => api.patch<User>(`/users/${encodeURIComponent(id)}`, patch);

export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, patch }: { id: number | string; patch: UserPatch }) => updateUser(id, patch),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: userKeys.all }),
  });
}

import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { SessionUser } from './get-me';

export interface CompletePasswordResetBody {
  token: string;
  password: string;
}

// Signs the user in: the client drops its CSRF token afterwards (lib/api-client.ts).
export const completePasswordReset = (body: CompletePasswordResetBody) =>
  api.post<{ user: SessionUser }>('/auth/password-reset/complete', body);

export function useCompletePasswordReset() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: completePasswordReset, onSuccess: () => queryClient.clear() });
}

import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';
import type { SessionUser } from './get-me';

export const SignInBody = z.object({
  email: z.email('E-mail: enter an address like name@example.org'),
  password: z.string().min(1, 'Password: enter your password'),
});
export type SignInBody = z.infer<typeof SignInBody>;

// The client drops its CSRF token after this call (lib/api-client.ts: the session is regenerated).
export const signIn = (body: SignInBody) => api.post<{ user: SessionUser }>('/auth/sign-in', body);

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    // A new session: nothing cached for a previous user may leak into it.
    onSuccess: () => queryClient.clear(),
  });
}

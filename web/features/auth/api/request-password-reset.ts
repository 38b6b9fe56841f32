import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';

export const PasswordResetBody = z.object({ email: z.email('E-mail: enter an address like name@example.org') });
export type PasswordResetBody = z.infer<typeof PasswordResetBody>;

export const requestPasswordReset = (body: PasswordResetBody) => api.post<{ sent: true }>('/auth/password-reset', body);

export const useRequestPasswordReset = () => useMutation({ mutationFn: requestPasswordReset });

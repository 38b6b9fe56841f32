import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';
import { ROLES } from '../../../config/permissions';
import { api } from '../../../lib/api-client';

export const InviteUserBody = z.object({
  email: z.email('E-mail: enter an address like name@example.org'),
  role: z.enum(ROLES, { error: 'Role: choose one of the roles' }),
});
export type InviteUserBody = z.infer<typeof InviteUserBody>;

export interface SentInvitation {
  id: string;
  email: string;
  role: string;
  expiresAt: string;
}

export const inviteUser = (body: InviteUserBody) => api.post<SentInvitation>('/users/invitations', body);

export const useInviteUser = () => useMutation({ mutationFn: inviteUser });

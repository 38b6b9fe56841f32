/** Path and body of /api/invitations/:token. */
import { z } from 'zod';
import { NewPassword } from '../../auth/passwords';

export const InvitationParams = z.strictObject({ token: z.string().min(1).max(200) });
export type InvitationParams = z.infer<typeof InvitationParams>;

export const AcceptInvitationBody = z.strictObject({
  displayName: z.string().trim().min(1, 'must not be empty').max(100, 'must be at most 100 characters'),
  password: NewPassword,
});
export type AcceptInvitationBody = z.infer<typeof AcceptInvitationBody>;

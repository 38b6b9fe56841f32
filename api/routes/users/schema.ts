/** Bodies and paths of /api/users. */
import { z } from 'zod';
import { ROLES } from '../../auth/permissions';

export const InviteUserBody = z.strictObject({ email: z.email('must be an e-mail address').max(320), role: z.enum(ROLES) });
export type InviteUserBody = z.infer<typeof InviteUserBody>;

export const UserParams = z.strictObject({ id: z.coerce.number().int().positive().max(2 ** 31 - 1) });
export type UserParams = z.infer<typeof UserParams>;

export const UpdateUserBody = z.strictObject({ role: z.enum(ROLES).optional(), active: z.boolean().optional() });
export type UpdateUserBody = z.infer<typeof UpdateUserBody>;

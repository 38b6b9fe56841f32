/** Request bodies of /api/auth. */
import { z } from 'zod';
import { NewPassword } from '../../auth/passwords';

// Sign-in accepts any text: a stricter rule here would tell which addresses cannot exist.
export const SignInBody = z.strictObject({
  email: z.string().min(1, 'is required').max(320),
  password: z.string().min(1, 'is required').max(1024),
});
export type SignInBody = z.infer<typeof SignInBody>;

export const PasswordResetBody = z.strictObject({ email: z.email('must be an e-mail address').max(320) });
export type PasswordResetBody = z.infer<typeof PasswordResetBody>;

export const PasswordResetCompleteBody = z.strictObject({ token: z.string().min(1).max(200), password: NewPassword });
export type PasswordResetCompleteBody = z.infer<typeof PasswordResetCompleteBody>;

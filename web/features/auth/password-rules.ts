import { z } from 'zod';

/** Minimum password length, the same as the API asks for. */
export const PASSWORD_MIN_LENGTH = 12;
export const PASSWORD_MAX_LENGTH = 256;

export const NewPassword = z
  .string()
  .min(PASSWORD_MIN_LENGTH, `Password: use at least ${PASSWORD_MIN_LENGTH} characters`)
  .max(PASSWORD_MAX_LENGTH, `Password: use at most ${PASSWORD_MAX_LENGTH} characters`);

/** The check that a new password was typed the same twice; with it, the message lands on the confirmation field. */
export const passwordsMatch = (v: { password: string; confirmPassword: string }) => v.password === v.confirmPassword;
export const PASSWORDS_DIFFER = { path: ['confirmPassword'], message: 'Confirm password: the two passwords are not the same' };

/** A new password typed twice. */
export const NewPasswordPair = z.object({ password: NewPassword, confirmPassword: z.string() }).refine(passwordsMatch, PASSWORDS_DIFFER);

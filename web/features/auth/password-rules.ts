import { z } from 'zod';

/** Minimum password length, the same as the API asks for. */
export const PASSWORD_MIN_LENGTH = 12;
export const PASSWORD_MAX_LENGTH = 256;

export const NewPassword = z
  .string()
  .min(PASSWORD_MIN_LENGTH, `Password: use at least ${PASSWORD_MIN_LENGTH} characters`)
  .max(PASSWORD_MAX_LENGTH, `Password: use at most ${PASSWORD_MAX_LENGTH} characters`);

/** A new password typed twice; the mismatch message lands on the confirmation field. */
export const NewPasswordPair = z
  .object({ password: NewPassword, confirmPassword: z.string() })
  .refine((v) => v.password === v.confirmPassword, {
    path: ['confirmPassword'],
    message: 'Confirm password: the two passwords are not the same',
  });

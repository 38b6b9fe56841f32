/**
 * Checks an e-mail + password. Unknown e-mail, wrong password and deactivated
 * account all give the same 401 invalid_credentials, and an unknown e-mail is
 * still verified against a dummy hash so the time taken does not tell them apart.
 */
import type { Knex } from 'knex';
import { dummyPasswordHash, verifyPassword } from '../../auth/passwords';
import { findUserByEmail, type UserRow } from '../../db/users';
import { AppError } from '../../errors';

export async function signIn(knex: Knex, input: { email: string; password: string }): Promise<UserRow> {
  const user = await findUserByEmail(knex, input.email);
  const hash = user?.password_hash ?? (await dummyPasswordHash());
  const passwordOk = await verifyPassword(hash, input.password);
  if (!user || !passwordOk || !user.active) {
    throw new AppError(401, 'invalid_credentials', 'e-mail or password is wrong');
  }
  return user;
}

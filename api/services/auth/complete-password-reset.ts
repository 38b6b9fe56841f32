/**
 * Sets a new password with a reset token: the token must be known, unused and
 * unexpired, and its account active. The token and every other open reset of
 * the account are used up, and the account's other sessions are ended.
 */
import type { Knex } from 'knex';
import { hashPassword } from '../../auth/passwords';
import { sha256Hex } from '../../auth/tokens';
import { deleteSessionsOfUser, findUserById, type UserRow } from '../../db/users';
import { fieldError } from '../../errors';

export async function completePasswordReset(knex: Knex, input: { token: string; password: string }): Promise<UserRow> {
  const passwordHash = await hashPassword(input.password); // before the transaction: ~200 ms
  const userId = await knex.transaction(async (trx) => {
    const reset = await trx('password_resets')
      .where({ token_sha256: sha256Hex(input.token) })
      .whereNull('used_at')
      .where('expires_at', '>', new Date())
      .forUpdate()
      .first();
    const user = reset ? await findUserById(trx, reset.user_id) : undefined;
    if (!reset || !user || !user.active) throw fieldError(['token'], 'unknown, used or expired reset link');
    await trx('password_resets').where({ user_id: user.id }).whereNull('used_at').update({ used_at: new Date() });
    await trx('users').where({ id: user.id }).update({ password_hash: passwordHash, updated_at: new Date() });
    await deleteSessionsOfUser(trx, user.id);
    return user.id;
  });
  return (await findUserById(knex, userId))!;
}

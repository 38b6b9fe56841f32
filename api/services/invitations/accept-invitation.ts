/** Accepting an invitation creates the account (role from the invitation) and uses the invitation up. */
import type { Knex } from 'knex';
import { hashPassword } from '../../auth/passwords';
import { findUserByEmail, findUserById, type UserRow } from '../../db/users';
import { conflict } from '../../errors';
import { findOpenInvitation } from './find-open-invitation';

export async function acceptInvitation(knex: Knex, token: string, input: { displayName: string; password: string }): Promise<UserRow> {
  await findOpenInvitation(knex, token); // 404 before spending ~200 ms on the hash
  const passwordHash = await hashPassword(input.password);
  const userId = await knex.transaction(async (trx) => {
    const invitation = await findOpenInvitation(trx, token, true);
    if (await findUserByEmail(trx, invitation.email)) throw conflict(`${invitation.email} already has an account`);
    const [id] = await trx('users').insert({
      email: invitation.email,
      display_name: input.displayName,
      role: invitation.role,
      password_hash: passwordHash,
    });
    await trx('invitations').where({ id: invitation.id }).update({ accepted_at: new Date() });
    return id as number;
  });
  return (await findUserById(knex, userId))!;
}

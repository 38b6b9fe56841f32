/**
 * An administrator changes a role or (de)activates an account. Administrators
 * cannot change their own role or deactivate themselves, so the group always
 * keeps the admin who is acting.
 */
import type { Knex } from 'knex';
import type { Role } from '../../auth/permissions';
import { findUserById, presentUser, type User } from '../../db/users';
import { conflict, notFound } from '../../errors';

export async function updateUser(knex: Knex, actorId: number, userId: number, change: { role?: Role; active?: boolean }): Promise<User> {
  const user = await findUserById(knex, userId);
  if (!user) throw notFound('user');
  if (userId === actorId && ((change.role !== undefined && change.role !== user.role) || change.active === false)) {
    throw conflict('you cannot change your own role or deactivate yourself');
  }
  const update: Record<string, unknown> = {};
  if (change.role !== undefined) update.role = change.role;
  if (change.active !== undefined) update.active = change.active;
  if (Object.keys(update).length > 0) await knex('users').where({ id: userId }).update({ ...update, updated_at: new Date() });
  return presentUser((await findUserById(knex, userId))!);
}

/** All accounts, oldest first. */
import type { Knex } from 'knex';
import { presentUser, type User, type UserRow } from '../../db/users';

export async function listUsers(knex: Knex): Promise<User[]> {
  const rows = await knex<UserRow>('users').orderBy('id');
  return rows.map((r) => presentUser(r as UserRow));
}

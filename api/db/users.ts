/** Row type of `users`, its JSON presentation and the small queries the services share. */
import type { Knex } from 'knex';
import type { Role } from '../auth/permissions';

export interface UserRow {
  id: number;
  email: string;
  display_name: string;
  role: Role;
  password_hash: string;
  active: number | boolean;
  created_at: Date;
  updated_at: Date;
}

export interface User {
  id: number;
  email: string;
  displayName: string;
  role: Role;
  active: boolean;
  createdAt: string;
}

export function presentUser(row: UserRow): User {
  return {
    id: row.id,
    email: row.email,
    displayName: row.display_name,
    role: row.role,
    active: Boolean(row.active),
    createdAt: row.created_at.toISOString(),
  };
}

/** E-mail addresses are compared lower-case and trimmed. */
export function normaliseEmail(email: string): string {
  return email.trim().toLowerCase();
}

export async function findUserById(knex: Knex, id: number): Promise<UserRow | undefined> {
  return knex<UserRow>('users').where({ id }).first();
}

export async function findUserByEmail(knex: Knex, email: string): Promise<UserRow | undefined> {
  return knex<UserRow>('users').where({ email: normaliseEmail(email) }).first();
}

/** Signs a user out everywhere (after a password reset): deletes every session holding their id. */
export async function deleteSessionsOfUser(knex: Knex, userId: number): Promise<number> {
  return knex('sessions').whereRaw("JSON_VALUE(sess, '$.userId') = ?", [userId]).del();
}

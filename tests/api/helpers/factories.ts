/** Small row factories for the API tests; every name is unique so files can share the database. */
import { randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import { hashPassword } from '../../../api/auth/passwords';
import type { Role } from '../../../api/auth/permissions';

export const TEST_PASSWORD = 'correct horse battery';

export function uniqueSuffix(): string {
  return randomBytes(4).toString('hex');
}

export function uniqueEmail(prefix: string): string {
  return `${prefix}-${uniqueSuffix()}@example.test`;
}

let testPasswordHash: Promise<string> | undefined;

export interface CreatedUser {
  id: number;
  email: string;
  password: string;
  role: Role;
}

/** A user with TEST_PASSWORD (hashed once per file: argon2id takes ~200 ms). */
export async function createUser(knex: Knex, role: Role, overrides: { email?: string; active?: boolean } = {}): Promise<CreatedUser> {
  testPasswordHash ??= hashPassword(TEST_PASSWORD);
  const email = overrides.email ?? uniqueEmail(role);
  const [id] = await knex('users').insert({
    email,
    display_name: `Test ${role}`,
    role,
    password_hash: await testPasswordHash,
    active: overrides.active ?? true,
  });
  return { id, email, password: TEST_PASSWORD, role };
}

export async function createPulsarRow(knex: Knex, createdBy: number | null = null): Promise<{ id: number; name: string }> {
  const name = `T${uniqueSuffix()}`;
  const [id] = await knex('pulsars').insert({ name, ra_hms: '01:02:03.4', dec_dms: '+05:06:07.8', created_by: createdBy });
  return { id, name };
}

export async function countRows(knex: Knex, table: string): Promise<number> {
  const [row] = await knex(table).count({ n: '*' });
  return Number(row.n);
}

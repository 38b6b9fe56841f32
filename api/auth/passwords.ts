/**
 * argon2id password hashing with the library's default cost (64 MiB, t=3, p=4;
 * ~200 ms here), and the rules a new password must meet.
 */
import argon2 from 'argon2';
import { randomBytes } from 'node:crypto';
import { z } from 'zod';

export const PASSWORD_MIN_CHARS = 12;
export const PASSWORD_MAX_CHARS = 256; // bounds the hashing work a request can ask for

export const NewPassword = z
  .string()
  .min(PASSWORD_MIN_CHARS, `must be at least ${PASSWORD_MIN_CHARS} characters`)
  .max(PASSWORD_MAX_CHARS, `must be at most ${PASSWORD_MAX_CHARS} characters`);

export function hashPassword(password: string): Promise<string> {
  return argon2.hash(password, { type: argon2.argon2id });
}

/** False (never a throw) for a wrong password or a malformed stored hash. */
export async function verifyPassword(hash: string, password: string): Promise<boolean> {
  try {
    return await argon2.verify(hash, password);
  } catch {
    return false;
  }
}

let dummyHash: Promise<string> | undefined;

/** A hash of a random secret, verified against when the e-mail is unknown so timing matches a real check. */
export function dummyPasswordHash(): Promise<string> {
  dummyHash ??= hashPassword(randomBytes(32).toString('hex'));
  return dummyHash;
}

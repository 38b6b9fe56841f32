/** Single-use e-mailed tokens: 32 random bytes (base64url) sent, only their SHA-256 stored. */
import { createHash, randomBytes } from 'node:crypto';

export function sha256Hex(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

export function newToken(): { token: string; tokenSha256: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, tokenSha256: sha256Hex(token) };
}

/** Shape of a token in a URL or body: 43 base64url characters; anything else is unknown. */
export const TOKEN_PATTERN = /^[A-Za-z0-9_-]{43}$/;

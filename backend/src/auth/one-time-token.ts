import { createHash, randomBytes } from 'node:crypto';

/** A fresh one-time token (32 random bytes, URL-safe) and the SHA-256 hash that is stored. */
export function newOneTimeToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, tokenHash: hashToken(token) };
}

/** Only the hash of a link token is stored, so a database leak does not leak usable links. */
export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

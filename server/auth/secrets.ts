import { createHash, randomBytes } from 'node:crypto';

/** A link token: 32 random bytes (256 bits) in base64url, 43 characters. */
export function newLinkToken(): string {
  return randomBytes(32).toString('base64url');
}

/** Only this hash is stored, so a copy of the database cannot be used to follow the links. */
export function hashLinkToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

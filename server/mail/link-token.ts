/**
 * Tokens for single-use e-mail links (invitations, password resets): 32 bytes from the CSPRNG
 * (256 bits) written as base64url (43 characters); only the SHA-256 of the token (hex) is stored, so
 * a copy of the database cannot be turned into working links.
 */
import { createHash, randomBytes } from 'node:crypto';

export const LINK_TOKEN_PATTERN = /^[A-Za-z0-9_-]{43}$/;

export function newLinkToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashLinkToken(token) };
}

export function hashLinkToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

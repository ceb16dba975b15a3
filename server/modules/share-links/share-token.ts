/**
 * Share-link tokens: 32 bytes from the CSPRNG (256 bits) written as 43 characters of base64url
 * (RFC 4648 §5). Only the token's sha256 (hex) is stored, so a leaked table yields no working link.
 */
import { createHash, randomBytes } from 'node:crypto';

export const TOKEN_BYTES = 32;
const TOKEN_PATTERN = /^[A-Za-z0-9_-]{43}$/;

export function newShareToken(): string {
  return randomBytes(TOKEN_BYTES).toString('base64url');
}

export function hashShareToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

/** Whether the text could be a token at all (checked before any query). */
export function isTokenShape(token: string): boolean {
  return TOKEN_PATTERN.test(token);
}

/**
 * Random ids for rows: 15 bytes from the CSPRNG written as 24 characters of lower-case base32
 * (RFC 4648 alphabet, a–z 2–7): URL-safe, case-free, unguessable (120 bits), no prefix.
 */
import { randomBytes } from 'node:crypto';

const ALPHABET = 'abcdefghijklmnopqrstuvwxyz234567';

export function encodeBase32(bytes: Uint8Array): string {
  let out = '';
  let buffer = 0;
  let bits = 0;
  for (const byte of bytes) {
    buffer = (buffer << 8) | byte;
    bits += 8;
    while (bits >= 5) {
      bits -= 5;
      out += ALPHABET[(buffer >>> bits) & 31];
    }
    buffer &= (1 << bits) - 1;
  }
  if (bits > 0) out += ALPHABET[(buffer << (5 - bits)) & 31];
  return out;
}

export function newId(): string {
  return encodeBase32(randomBytes(15));
}

/**
 * Password hashing with argon2id (@node-rs/argon2), PHC string output ("$argon2id$v=19$m=…").
 * Parameters: m = 19 MiB, t = 2, p = 1 — the OWASP Password Storage Cheat Sheet's first argon2id
 * configuration (common practice, from memory).
 */
import { hash, verify, type Algorithm, type Options } from '@node-rs/argon2';
import { randomBytes } from 'node:crypto';

const ARGON2ID = 2 as Algorithm; // Algorithm.Argon2id (a const enum, which isolatedModules cannot read)

const OPTIONS: Options = { algorithm: ARGON2ID, memoryCost: 19_456, timeCost: 2, parallelism: 1, outputLen: 32 };

export function hashPassword(password: string): Promise<string> {
  return hash(password, OPTIONS);
}

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false; // a malformed stored hash never signs anyone in
  }
}

let dummyHash: Promise<string> | undefined;

/**
 * A hash of a random password with the same parameters: sign-in verifies against it when no account
 * has the e-mail, so a missing account costs the same time as a wrong password.
 */
export function dummyPasswordHash(): Promise<string> {
  dummyHash ??= hashPassword(randomBytes(24).toString('base64url'));
  return dummyHash;
}

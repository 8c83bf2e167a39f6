/**
 * Password hashing with argon2id (the `argon2` package). Parameters: 19 MiB memory, 2 passes,
 * 1 lane — the minimum the OWASP Password Storage Cheat Sheet recommends for argon2id (common
 * practice, not a standard). Passwords themselves are never stored or logged.
 */
import argon2 from 'argon2';
import { randomBytes } from 'node:crypto';

const OPTIONS = { type: argon2.argon2id, memoryCost: 19_456, timeCost: 2, parallelism: 1 } as const;

/** Shortest password accepted, characters. */
export const MIN_PASSWORD_LENGTH = 12;

export function hashPassword(password: string): Promise<string> {
  return argon2.hash(password, OPTIONS);
}

/** A hash checked when the user does not exist, so both answers take about as long. */
let dummyHash: Promise<string> | undefined;

export async function verifyPassword(hash: string | undefined, password: string): Promise<boolean> {
  if (hash === undefined) {
    dummyHash ??= hashPassword(randomBytes(16).toString('hex'));
    await argon2.verify(await dummyHash, password).catch(() => false);
    return false;
  }
  try {
    return await argon2.verify(hash, password);
  } catch {
    return false;
  }
}

/** A random password for `drydig user add|reset` (20 base64url characters, 120 bits). */
export function generatePassword(): string {
  return randomBytes(15).toString('base64url');
}

/**
 * Share-link tokens and record ids. Tokens are 256 bits from the platform CSPRNG, sent once to the
 * creator and stored only as a SHA-256 hash, so a copy of the database cannot open any link.
 */
import { createHash, randomBytes } from 'node:crypto';

/** Bytes of randomness in a share token (256 bits; the issue asks for at least 128). */
export const TOKEN_BYTES = 32;

/** A token is 43 base64url characters (32 bytes, no padding). */
export const TOKEN_PATTERN = '^[A-Za-z0-9_-]{43}$';
const TOKEN_RE = new RegExp(TOKEN_PATTERN);

/** A new share token: 32 random bytes, base64url. */
export function createShareToken(): string {
  return randomBytes(TOKEN_BYTES).toString('base64url');
}

/** SHA-256 of a token, hex. A fast hash is enough: the token has 256 bits of entropy. */
export function hashShareToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

/** True when the text has the shape of a token (checked before any lookup). */
export function isTokenShaped(text: string): boolean {
  return TOKEN_RE.test(text);
}

/** A random URL-safe id of `bytes` bytes (scenario ids: 16 bytes, not guessable either). */
export function createRecordId(bytes = 16): string {
  return randomBytes(bytes).toString('base64url');
}

/** SHA-256 hex of a text (stored-revision checksums). */
export function sha256Hex(text: string): string {
  return createHash('sha256').update(text, 'utf8').digest('hex');
}

import bcrypt from 'bcryptjs';
import { MAX_PASSWORD_BYTES } from '@cellwarden/shared';

// Cost 10 is bcrypt's long-standing default (common practice): ~50–100 ms per check on a small server.
const BCRYPT_COST = 10;

/**
 * bcrypt reads at most 72 bytes of its input (Provos & Mazières 1999, the algorithm's key schedule), so a
 * longer password would be cut silently. New passwords are refused above it instead of being pre-hashed,
 * which keeps stored hashes plain bcrypt; at sign-in a longer one simply cannot match.
 */
export const PASSWORD_MAX_BYTES = MAX_PASSWORD_BYTES;

/** Whether a password is longer than bcrypt reads, in UTF-8 bytes. */
export function exceedsHashInput(password: string): boolean {
  return Buffer.byteLength(password, 'utf8') > PASSWORD_MAX_BYTES;
}

/** Hashes a password for storage. */
export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, BCRYPT_COST);
}

/** Checks a password against its stored hash in constant time. */
export function verifyPassword(password: string, hash: string): Promise<boolean> {
  return bcrypt.compare(password, hash);
}

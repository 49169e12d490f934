import bcrypt from 'bcryptjs';

// Cost 10 is bcrypt's long-standing default (common practice): ~50–100 ms per check on a small server.
const BCRYPT_COST = 10;

/** Hashes a password for storage. */
export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, BCRYPT_COST);
}

/** Checks a password against its stored hash in constant time. */
export function verifyPassword(password: string, hash: string): Promise<boolean> {
  return bcrypt.compare(password, hash);
}

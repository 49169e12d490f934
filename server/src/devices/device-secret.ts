import { createHash, randomBytes, timingSafeEqual } from 'node:crypto';
import bcrypt from 'bcryptjs';

// Device secrets are made by Cellwarden: 24 random bytes, 192 bits. NIST SP 800-63B §5.1.2.2 lets a
// verifier store a look-up secret of at least 112 bits hashed with an approved one-way function (no slow
// key derivation needed, since it cannot be guessed), so a check is one SHA-256: microseconds, and a flood
// of wrong secrets cannot stall the server the way a password hash per connect did.
const SCHEME = 'sha256$';

/** A fresh device secret (192 random bits, base64url). */
export function newDeviceSecret(): string {
  return randomBytes(24).toString('base64url');
}

const digest = (secret: string) => createHash('sha256').update(secret, 'utf8').digest();

/** What is stored for a device secret. */
export function hashDeviceSecret(secret: string): string {
  return `${SCHEME}${digest(secret).toString('hex')}`;
}

// Compared against when the device is unknown, so a wrong secret costs the same for known and unknown ids.
const UNKNOWN_DEVICE = digest(newDeviceSecret());

/** Whether a stored hash predates SHA-256 storage (bcrypt); checked once and then re-stored. */
export const isLegacyDeviceHash = (stored: string) => stored.startsWith('$2');

/**
 * Checks a secret against its stored hash in constant time; `stored` undefined (unknown device) does the
 * same work and answers false. A legacy bcrypt hash is checked the slow way (only until it is re-stored).
 */
export async function verifyDeviceSecret(secret: string, stored: string | undefined): Promise<boolean> {
  if (stored !== undefined && isLegacyDeviceHash(stored)) return bcrypt.compare(secret, stored);
  const expected =
    stored?.startsWith(SCHEME) && stored.length === SCHEME.length + 64
      ? Buffer.from(stored.slice(SCHEME.length), 'hex')
      : UNKNOWN_DEVICE;
  const matches = timingSafeEqual(digest(secret), expected);
  return matches && expected !== UNKNOWN_DEVICE;
}

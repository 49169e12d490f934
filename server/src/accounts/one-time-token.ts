import { createHash, randomBytes } from 'node:crypto';

/** A fresh unguessable token (256 bits) for links and refresh cookies; only its hash is ever stored. */
export function newOneTimeToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashToken(token) };
}

/** SHA-256 of a token, as stored: a leaked table gives no usable tokens. */
export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

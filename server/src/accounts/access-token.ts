import { createSecretKey, type KeyObject } from 'node:crypto';
import jwt from 'jsonwebtoken';
import { z } from 'zod';

/** The one signing algorithm; verification refuses any other, so `alg: none` and key confusion fail. */
export const TOKEN_ALGORITHM = 'HS256';
export const TOKEN_AUDIENCE = 'cellwarden';

// What every access token must carry (RFC 7519 §4.1: sub, aud, iat, exp; `sid` names the sign-in session).
// jsonwebtoken accepts a token without `exp` as never expiring, so presence is checked here, not assumed.
const accessClaims = z.object({
  sub: z.uuid(),
  sid: z.uuid(),
  aud: z.literal(TOKEN_AUDIENCE),
  iat: z.number().int(),
  exp: z.number().int(),
});

/** The claims Cellwarden relies on once a token's signature, audience and expiry have been verified. */
export interface AccessClaims {
  userId: string;
  sessionId: string;
  /** When the token stops being accepted, epoch milliseconds. */
  expiresAt: number;
}

const secretKeys = new Map<string, KeyObject>();
/**
 * The signing secret as a key object, made once per secret: given a string, jsonwebtoken first tries to read it
 * as a PEM public key, and that failed attempt cost about a third of a millisecond of CPU on every request.
 */
export function tokenKey(secret: string): KeyObject {
  let key = secretKeys.get(secret);
  if (!key) secretKeys.set(secret, (key = createSecretKey(Buffer.from(secret))));
  return key;
}

/** Signs an access token for one sign-in session. */
export function signAccessToken(
  secret: string,
  claims: { userId: string; sessionId: string },
  ttlSeconds: number,
): string {
  return jwt.sign({ sid: claims.sessionId }, tokenKey(secret), {
    algorithm: TOKEN_ALGORITHM,
    subject: claims.userId,
    audience: TOKEN_AUDIENCE,
    expiresIn: ttlSeconds,
  });
}

/** Reads verified claims; undefined when any required claim is missing or malformed. */
export function readAccessClaims(payload: unknown): AccessClaims | undefined {
  const parsed = accessClaims.safeParse(payload);
  if (!parsed.success || parsed.data.exp <= parsed.data.iat) return undefined;
  return { userId: parsed.data.sub, sessionId: parsed.data.sid, expiresAt: parsed.data.exp * 1000 };
}

/** Verifies signature, algorithm, audience and expiry, then the claims; throws with the reason. */
export function verifyAccessToken(token: string, secret: string): AccessClaims {
  const payload = jwt.verify(token, tokenKey(secret), {
    algorithms: [TOKEN_ALGORITHM],
    audience: TOKEN_AUDIENCE,
  });
  const claims = readAccessClaims(payload);
  if (!claims) throw new Error('token lacks a required claim (sub, sid, aud, iat, exp)');
  return claims;
}

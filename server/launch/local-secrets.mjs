// Secrets of a local installation, made on first use and kept in the ignored data folder, readable only
// by the user who runs Cellwarden. Nothing secret is written in the repository. Node built-ins only.
import { randomBytes } from 'node:crypto';
import { chmodSync, existsSync, readFileSync, writeFileSync } from 'node:fs';

/**
 * The secret kept in `path`, made (48 random bytes, base64url) when the file does not exist yet. `legacy`
 * is returned instead of a new secret when `legacyWhen()` says an older installation already relies on it.
 */
export function readOrCreateSecret(path, { legacy, legacyWhen } = {}) {
  if (existsSync(path)) {
    chmodSync(path, 0o600);
    return readFileSync(path, 'utf8').trim();
  }
  const secret = legacy !== undefined && legacyWhen?.() ? legacy : randomBytes(48).toString('base64url');
  writeFileSync(path, `${secret}\n`, { mode: 0o600, flag: 'wx' });
  return secret;
}

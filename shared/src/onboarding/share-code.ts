// The short code an owner reads out on the phone so a support person can ask for access to one system.
//
// Why eight characters of a 32-symbol alphabet (40 bits) are enough: a code lives 15 minutes and is used once;
// each person may try at most SHARE_CODE_ATTEMPTS wrong codes per window and the server as a whole
// SHARE_CODE_GLOBAL_ATTEMPTS. With N codes live at once, one guess hits any of them with probability
// N / 2^40; at 1,000 live codes and the global ceiling of 2,000 guesses in a window, that is 2,000 × 1,000 /
// 2^40 ≈ 1.8e-6 per window (from the code's own arithmetic, not a standard). A hit still only files a
// request: the owner must approve it.

/** Crockford's base32 symbols: no I, L, O or U, so nothing is misheard or misread (I→1, L→1, O→0). */
export const SHARE_CODE_ALPHABET = '0123456789ABCDEFGHJKMNPQRSTVWXYZ';
/** Symbols in a code. */
export const SHARE_CODE_LENGTH = 8;
/** How long a code stays good, ms. */
export const SHARE_CODE_TTL_MS = 15 * 60 * 1000;
/** Wrong codes one person may try per window. */
export const SHARE_CODE_ATTEMPTS = 5;
/** Wrong codes the whole server accepts per window before every code attempt waits for the next one. */
export const SHARE_CODE_GLOBAL_ATTEMPTS = 2000;

// Crockford's decoding: what people type for a symbol that is not in the alphabet.
const LOOK_ALIKES: Record<string, string> = { I: '1', L: '1', O: '0' };

/** The canonical code from what a person typed (case, spaces, dashes, look-alikes), or null when it cannot be one. */
export function normalizeShareCode(typed: string): string | null {
  const symbols = typed
    .toUpperCase()
    .replace(/[\s-]/g, '')
    .replace(/[ILO]/g, (c) => LOOK_ALIKES[c]);
  if (symbols.length !== SHARE_CODE_LENGTH) return null;
  return [...symbols].every((c) => SHARE_CODE_ALPHABET.includes(c)) ? symbols : null;
}

/** Makes a code from random bytes (one per symbol, taken modulo 32: 256 is a multiple of 32, so no bias). */
export function shareCodeFromBytes(bytes: Uint8Array): string {
  if (bytes.length < SHARE_CODE_LENGTH) throw new Error(`need ${SHARE_CODE_LENGTH} random bytes`);
  return [...bytes.slice(0, SHARE_CODE_LENGTH)].map((b) => SHARE_CODE_ALPHABET[b % 32]).join('');
}

/** A code in two groups of four, as it is shown and read out: "K7QM-2XHD". */
export function formatShareCode(code: string): string {
  return `${code.slice(0, 4)}-${code.slice(4)}`;
}

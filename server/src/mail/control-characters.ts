// C0 and C1 controls (CR, LF, TAB, NUL, ESC ...), DEL, line/paragraph separators and the invisible
// bidirectional/zero-width marks that can disguise a name (e.g. U+202E reversing "gpj.exe").
// eslint-disable-next-line no-control-regex -- matching control characters is the point
const CONTROL_CHARACTERS = /[\u0000-\u001f\u007f-\u009f\u200b-\u200f\u2028-\u202e\u2066-\u2069\ufeff]+/g;

/** True when `text` holds any character `stripControlCharacters` would remove. */
export function hasControlCharacters(text: string): boolean {
  return new RegExp(CONTROL_CHARACTERS.source).test(text);
}

/** One line of plain text: every control or invisible formatting character becomes a space, runs collapse. */
export function stripControlCharacters(text: string): string {
  return text.replace(CONTROL_CHARACTERS, ' ').replace(/ {2,}/g, ' ').trim();
}

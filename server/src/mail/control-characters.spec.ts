import { hasControlCharacters, stripControlCharacters } from './control-characters';

describe('stripControlCharacters', () => {
  it('turns CR/LF into one space so no header line can start', () => {
    expect(stripControlCharacters('Hi\r\nBcc: eve@attacker.test')).toBe('Hi Bcc: eve@attacker.test');
  });

  // Unicode 15, General Category Cc (U+0000-U+001F, U+007F-U+009F) and Cf bidi overrides (U+202A-U+202E).
  it.each([
    ['NUL', 'a\u0000b'],
    ['ESC', 'a\u001bb'],
    ['DEL', 'a\u007fb'],
    ['C1 NEL', 'a\u0085b'],
    ['right-to-left override', 'a\u202eb'],
    ['line separator', 'a\u2028b'],
  ])('removes %s', (_name, text) => {
    expect(hasControlCharacters(text)).toBe(true);
    expect(stripControlCharacters(text)).toBe('a b');
  });

  it('leaves ordinary text, accents and symbols alone', () => {
    expect(hasControlCharacters('Bjørn’s van – 12 V, 25 °C')).toBe(false);
    expect(stripControlCharacters('Bjørn’s van – 12 V, 25 °C')).toBe('Bjørn’s van – 12 V, 25 °C');
  });
});

import { FALLBACK_LOCALE, SUPPORTED_LOCALES, resolveLocale } from './locale';

describe('resolveLocale', () => {
  it('takes the exact regional locale when it is carried', () =>
    expect(resolveLocale(['en-GB', 'en'])).toBe('en-GB'));

  it('falls back from a region it does not carry to the language', () =>
    expect(resolveLocale(['de-LU'])).toBe('de'));

  it('takes the first preferred language it carries', () =>
    expect(resolveLocale(['ja-JP', 'sv-SE', 'en'])).toBe('sv'));

  it('reads Norwegian as Bokmål', () => expect(resolveLocale(['no'])).toBe('nb'));

  it('uses en-US for plain English, for unknown languages and for none at all', () => {
    expect(resolveLocale(['en'])).toBe(FALLBACK_LOCALE);
    expect(resolveLocale(['ja'])).toBe(FALLBACK_LOCALE);
    expect(resolveLocale([])).toBe(FALLBACK_LOCALE);
  });

  it('resolves each carried locale to itself, so its data is the one loaded', () =>
    SUPPORTED_LOCALES.filter((l) => l !== 'en').forEach((l) => expect(resolveLocale([l])).toBe(l)));
});

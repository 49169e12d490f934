import { registerLocaleData } from '@angular/common';

// Each locale's data is its own lazy chunk, so a visitor downloads only the one their browser asks for.
const LOCALE_DATA: Record<string, () => Promise<{ default: unknown[] }>> = {
  'en-GB': () => import('@angular/common/locales/en-GB'),
  'en-AU': () => import('@angular/common/locales/en-AU'),
  'en-CA': () => import('@angular/common/locales/en-CA'),
  'en-IE': () => import('@angular/common/locales/en-IE'),
  'en-NZ': () => import('@angular/common/locales/en-NZ'),
  de: () => import('@angular/common/locales/de'),
  'de-AT': () => import('@angular/common/locales/de-AT'),
  'de-CH': () => import('@angular/common/locales/de-CH'),
  fr: () => import('@angular/common/locales/fr'),
  'fr-CA': () => import('@angular/common/locales/fr-CA'),
  nl: () => import('@angular/common/locales/nl'),
  es: () => import('@angular/common/locales/es'),
  it: () => import('@angular/common/locales/it'),
  sv: () => import('@angular/common/locales/sv'),
  da: () => import('@angular/common/locales/da'),
  nb: () => import('@angular/common/locales/nb'),
  fi: () => import('@angular/common/locales/fi'),
  pl: () => import('@angular/common/locales/pl'),
  pt: () => import('@angular/common/locales/pt'),
  'pt-PT': () => import('@angular/common/locales/pt-PT'),
};

/** The locale used when the browser asks for none we carry: Angular's built-in English. */
export const FALLBACK_LOCALE = 'en-US';

/** Locales whose number and date data the dashboard carries (besides the built-in en-US). */
export const SUPPORTED_LOCALES: readonly string[] = [FALLBACK_LOCALE, 'en', ...Object.keys(LOCALE_DATA)];

// Norwegian browsers may say "no" or "nn"; Bokmål's data is the closest we carry.
const ALIASES: Record<string, string> = { no: 'nb', nn: 'nb' };

/**
 * The first of the browser's preferred languages we carry: the exact tag ("en-GB"), else its language
 * ("de-LU" → "de"), else en-US.
 */
export function resolveLocale(languages: readonly string[]): string {
  for (const raw of languages) {
    if (!raw) continue;
    const tag = canonical(raw);
    if (tag === 'en' || tag === 'en-US') return FALLBACK_LOCALE;
    if (tag in LOCALE_DATA) return tag;
    const language = ALIASES[tag.split('-')[0]] ?? tag.split('-')[0];
    if (language === 'en') return FALLBACK_LOCALE;
    if (language in LOCALE_DATA) return language;
  }
  return FALLBACK_LOCALE;
}

/** Registers the number and date data of `locale` with Angular (en-US is built in). */
export async function loadLocaleData(locale: string): Promise<void> {
  const load = LOCALE_DATA[locale];
  if (!load) return;
  const data = await load();
  registerLocaleData(data.default, locale);
}

function canonical(tag: string): string {
  try {
    return Intl.getCanonicalLocales(tag.replace('_', '-'))[0] ?? tag;
  } catch {
    return tag;
  }
}

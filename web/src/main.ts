import { LOCALE_ID } from '@angular/core';
import { bootstrapApplication } from '@angular/platform-browser';
import { App } from './app/app';
import { appConfig } from './app/app.config';
import { loadLocaleData, resolveLocale } from './app/core/locale';

// Numbers and dates follow the browser's language: its locale data loads before the first screen renders.
const locale = resolveLocale(navigator.languages?.length ? navigator.languages : [navigator.language]);

loadLocaleData(locale)
  .catch((error: unknown) => console.error(error))
  .then(() =>
    bootstrapApplication(App, {
      ...appConfig,
      providers: [...appConfig.providers, { provide: LOCALE_ID, useValue: locale }],
    }),
  )
  .catch((error: unknown) => console.error(error));

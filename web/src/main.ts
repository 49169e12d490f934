import { LOCALE_ID } from '@angular/core';
import { bootstrapApplication } from '@angular/platform-browser';
import { App } from './app/app';
import { appConfig } from './app/app.config';
import { loadLocaleData, resolveLocale } from './app/core/locale';

// The bench reads these two marks to tell the code's own start and bootstrap apart from the network.
performance.mark('cw:main-start');

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
  .then(() => performance.mark('cw:bootstrapped'))
  .catch((error: unknown) => console.error(error));

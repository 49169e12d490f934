import { LOCALE_ID, provideAppInitializer } from '@angular/core';
import { bootstrapApplication } from '@angular/platform-browser';
import { App } from './app/app';
import { appConfig } from './app/app.config';
import { loadLocaleData, resolveLocale } from './app/core/locale';

// The bench reads these two marks to tell the code's own start and bootstrap apart from the network.
performance.mark('cw:main-start');

// A reload of a system's live view, the screen opened most, asks for that view's code now, beside bootstrap:
// the router would ask only once bootstrap is done and the session guard has run, and then finds it loaded.
// The same for the route's head start, so it can ask for the status as soon as the guard lets it.
if (/^\/systems\/(?!new\/?$)[^/]+\/?$/.test(location.pathname)) {
  import('./app/live/live').catch(() => undefined);
  import('./app/core/live-head-start').catch(() => undefined);
}

// Numbers and dates follow the browser's language. Its locale data loads while Angular sets up, and the first
// screen waits for it (an app initializer holds the first render and navigation).
const locale = resolveLocale(navigator.languages?.length ? navigator.languages : [navigator.language]);
const localeData = loadLocaleData(locale).catch((error: unknown) => console.error(error));

bootstrapApplication(App, {
  ...appConfig,
  providers: [
    ...appConfig.providers,
    { provide: LOCALE_ID, useValue: locale },
    provideAppInitializer(() => localeData),
  ],
})
  .then(() => performance.mark('cw:bootstrapped'))
  .catch((error: unknown) => console.error(error));

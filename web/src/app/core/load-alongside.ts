import type { CanActivateFn } from '@angular/router';

/**
 * A guard that only starts loading a lazy view. The router fetches a route's `loadComponent` after all its
 * guards have passed, so a first visit to the live view waited for the session refresh and only then asked
 * for the view's code; listed before the real guards, this starts that download while they run. It always
 * lets the navigation on (the other guards decide), and the router then finds the module already loaded.
 */
export function loadAlongside(load: () => Promise<unknown>): CanActivateFn {
  return () => {
    // A failed download surfaces through the router's own loadComponent, which asks again.
    load().catch(() => undefined);
    return true;
  };
}

import type { ActivatedRouteSnapshot, RouterStateSnapshot } from '@angular/router';
import { loadAlongside } from './load-alongside';

const route = {} as ActivatedRouteSnapshot;
const state = {} as RouterStateSnapshot;

describe('loadAlongside', () => {
  it('starts the load at once and lets the navigation on without waiting for it', () => {
    let started = 0;
    const guard = loadAlongside(() => {
      started++;
      return new Promise(() => undefined);
    });
    expect(guard(route, state)).toBe(true);
    expect(started).toBe(1);
  });

  it('lets the navigation on when the load fails (the router reports it)', async () => {
    const guard = loadAlongside(() => Promise.reject(new Error('offline')));
    expect(guard(route, state)).toBe(true);
    await Promise.resolve();
  });
});

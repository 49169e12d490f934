import { inject } from '@angular/core';
import { CanActivateFn, Router } from '@angular/router';
import type { Role } from '@cellwarden/shared';
import { map } from 'rxjs';
import { Auth } from './auth';

/** Lets through signed-in users holding one of `roles`; others go to sign-in or back to their systems. */
export function roleGuard(roles: readonly Role[]): CanActivateFn {
  return (_route, state) => {
    const auth = inject(Auth);
    const router = inject(Router);
    return auth.restoreSession().pipe(
      map((signedIn) => {
        if (!signedIn) return router.createUrlTree(['/sign-in'], { queryParams: { returnUrl: state.url } });
        return auth.hasAnyRole(roles) ? true : router.createUrlTree(['/systems']);
      }),
    );
  };
}

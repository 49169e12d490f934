import { inject } from '@angular/core';
import { CanActivateFn, Router } from '@angular/router';
import { map } from 'rxjs';
import { Auth } from './auth';

/** Lets signed-in users through (restoring the session from the refresh cookie first); others go to sign-in. */
export const authGuard: CanActivateFn = (_route, state) => {
  const router = inject(Router);
  return inject(Auth)
    .restoreSession()
    .pipe(
      map((signedIn) =>
        signedIn ? true : router.createUrlTree(['/sign-in'], { queryParams: { returnUrl: state.url } }),
      ),
    );
};

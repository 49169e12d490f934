import { HttpErrorResponse, HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { catchError, throwError } from 'rxjs';
import { Auth } from './auth';

/** Adds the bearer token to /api calls; on 401 drops the session and sends the user to /sign-in. */
export const authInterceptor: HttpInterceptorFn = (request, next) => {
  const auth = inject(Auth);
  const isApi = request.url.startsWith('/api/');
  const token = auth.accessToken();
  const outgoing =
    isApi && token ? request.clone({ setHeaders: { Authorization: `Bearer ${token}` } }) : request;
  return next(outgoing).pipe(
    catchError((error: unknown) => {
      const isSignIn = request.url.startsWith('/api/auth/sign-in');
      if (isApi && !isSignIn && error instanceof HttpErrorResponse && error.status === 401) {
        // The token is no longer accepted: forget it so the guard does not let the user back in.
        auth.signOut();
      }
      return throwError(() => error);
    }),
  );
};

import { HttpErrorResponse, HttpInterceptorFn, HttpRequest } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, of, switchMap, throwError } from 'rxjs';
import { Auth } from './auth';

/**
 * Adds the bearer token to /api calls. On a 401 from anything but /api/auth/*, refreshes the token once
 * (parallel requests share the refresh) and retries; if that fails too, ends the session and sends the
 * user to sign-in with a return URL.
 */
export const authInterceptor: HttpInterceptorFn = (request, next) => {
  if (!request.url.startsWith('/api/')) return next(request);
  const auth = inject(Auth);
  const router = inject(Router);
  const sentToken = auth.accessToken();
  return next(withBearer(request, sentToken)).pipe(
    catchError((error: unknown) => {
      if (!isUnauthorized(error) || request.url.startsWith('/api/auth/')) return throwError(() => error);
      // Another request may already have refreshed while this one was on the wire: reuse its token.
      const current = auth.accessToken();
      const token$ = current && current !== sentToken ? of(current) : auth.refresh();
      return token$.pipe(
        switchMap((token) => {
          if (!token) {
            // Refused: the session is over. Unreachable: keep it and let the screen show the error.
            if (!auth.isSignedIn()) auth.endSession(router.url);
            return throwError(() => error);
          }
          return next(withBearer(request, token)).pipe(
            catchError((retryError: unknown) => {
              if (isUnauthorized(retryError)) auth.endSession(router.url);
              return throwError(() => retryError);
            }),
          );
        }),
      );
    }),
  );
};

function withBearer<T>(request: HttpRequest<T>, token: string | null): HttpRequest<T> {
  return token ? request.clone({ setHeaders: { Authorization: `Bearer ${token}` } }) : request;
}

function isUnauthorized(error: unknown): boolean {
  return error instanceof HttpErrorResponse && error.status === 401;
}

import { HttpClient, HttpErrorResponse } from '@angular/common/http';
import { DestroyRef, Injectable, computed, inject, signal } from '@angular/core';
import { Router } from '@angular/router';
import type { InvitationAcceptance, PublicUser, Role, SessionResponse } from '@cellwarden/shared';
import { Observable, catchError, finalize, from, map, of, shareReplay, tap } from 'rxjs';
import { SESSION_HEAD_START } from './session-head-start';

/** How long before the access token expires it is renewed, s. */
const RENEW_BEFORE_EXPIRY_S = 60;
/** Never renew sooner than this after a session arrives, so a short-lived token cannot cause a request storm. */
const RENEW_AT_LEAST_AFTER_MS = 10_000;

/**
 * The signed-in session. The access token lives only in memory; the refresh token is an httpOnly cookie
 * the browser sends to /api/auth/refresh, so a reload restores the session through `restoreSession()`.
 */
@Injectable({ providedIn: 'root' })
export class Auth {
  private readonly http = inject(HttpClient);
  private readonly router = inject(Router);
  private readonly session = signal<SessionResponse | null>(null);
  private refreshInFlight: Observable<string | null> | null = null;
  private restoreAttempted = false;
  private renewal: ReturnType<typeof setTimeout> | undefined;
  // A renewal the page sent before the app ran; the first refresh takes it over instead of sending its own.
  private headStart = inject(SESSION_HEAD_START);

  constructor() {
    inject(DestroyRef).onDestroy(() => clearTimeout(this.renewal));
  }

  /** The signed-in user, or null. */
  readonly currentUser = computed<PublicUser | null>(() => this.session()?.user ?? null);
  /** The bearer token for API calls, or null. */
  readonly accessToken = computed(() => this.session()?.accessToken ?? null);
  /** Whether someone is signed in. */
  readonly isSignedIn = computed(() => this.session() !== null);

  /** Whether the signed-in user holds at least one of `roles`. */
  hasAnyRole(roles: readonly Role[]): boolean {
    const held = this.currentUser()?.roles ?? [];
    return roles.some((role) => held.includes(role));
  }

  /** Signs in with e-mail and password; errors come through as HttpErrorResponse. */
  signIn(email: string, password: string): Observable<SessionResponse> {
    return this.http
      .post<SessionResponse>('/api/auth/sign-in', { email, password })
      .pipe(tap((response) => this.keep(response)));
  }

  /** Accepts an invitation; the answer is a session, so the new member is signed in at once. */
  acceptInvitation(acceptance: InvitationAcceptance): Observable<SessionResponse> {
    return this.http
      .post<SessionResponse>('/api/auth/invitations/accept', acceptance)
      .pipe(tap((response) => this.keep(response)));
  }

  /**
   * Asks for a new access token with the refresh cookie. Parallel callers share one request; the
   * observable emits the new token, or null when it failed (a refusal also drops the session).
   */
  refresh(): Observable<string | null> {
    this.refreshInFlight ??= this.renewal$().pipe(
      tap((response) => this.keep(response)),
      map((response) => response.accessToken),
      catchError((error: unknown) => {
        // Only a refusal ends the session; a dropped connection on a van's mobile link should not.
        if (error instanceof HttpErrorResponse && error.status >= 400 && error.status < 500) this.forget();
        return of(null);
      }),
      finalize(() => (this.refreshInFlight = null)),
      shareReplay({ bufferSize: 1, refCount: false }),
    );
    return this.refreshInFlight;
  }

  /**
   * The refresh request: the one already on its way since the page loaded if it is still untaken (a second one
   * beside it would present a refresh token the first has just replaced, which the server treats as theft),
   * else a new one.
   */
  private renewal$(): Observable<SessionResponse> {
    const started = this.headStart;
    if (!started) return this.http.post<SessionResponse>('/api/auth/refresh', {});
    this.headStart = null;
    return from(started).pipe(
      map((answer) => {
        if (answer.body && answer.status >= 200 && answer.status < 300) return answer.body;
        // The same error HttpClient would raise, so a refusal and a lost connection are told apart as before.
        throw new HttpErrorResponse({ status: answer.status, url: '/api/auth/refresh' });
      }),
    );
  }

  /** Emits whether a session exists, trying the refresh cookie once per page load when none is held. */
  restoreSession(): Observable<boolean> {
    if (this.isSignedIn()) return of(true);
    if (this.restoreAttempted && !this.refreshInFlight) return of(false);
    this.restoreAttempted = true;
    return this.refresh().pipe(map((token) => token !== null));
  }

  /** Tells the server to end the session (it clears the refresh cookie), then forgets it here. */
  signOut(): void {
    const forget = () => this.endSession();
    this.http.post('/api/auth/sign-out', {}).subscribe({ complete: forget, error: forget });
  }

  /** Forgets the session without asking the server and goes to sign-in, coming back to `returnUrl`. */
  endSession(returnUrl?: string): void {
    this.forget();
    const keep = returnUrl && !returnUrl.startsWith('/sign-in') && returnUrl !== '/';
    void this.router.navigate(['/sign-in'], keep ? { queryParams: { returnUrl } } : {});
  }

  /**
   * Holds the session and renews the token a minute before it expires, so the live stream can reconnect
   * with a valid token even when no HTTP call has met a 401.
   */
  private keep(response: SessionResponse): void {
    this.session.set(response);
    clearTimeout(this.renewal);
    const renewInMs = Math.max(RENEW_AT_LEAST_AFTER_MS, (response.expiresIn - RENEW_BEFORE_EXPIRY_S) * 1000);
    this.renewal = setTimeout(() => this.refresh().subscribe(), renewInMs);
  }

  private forget(): void {
    clearTimeout(this.renewal);
    this.session.set(null);
  }
}

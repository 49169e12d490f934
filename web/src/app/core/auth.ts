import { HttpClient } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { Router } from '@angular/router';
import type { InvitationAcceptance, PublicUser, Role, SessionResponse } from '@cellwarden/shared';
import { Observable, catchError, finalize, map, of, shareReplay, tap } from 'rxjs';

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
      .pipe(tap((response) => this.session.set(response)));
  }

  /** Accepts an invitation; the answer is a session, so the new member is signed in at once. */
  acceptInvitation(acceptance: InvitationAcceptance): Observable<SessionResponse> {
    return this.http
      .post<SessionResponse>('/api/auth/invitations/accept', acceptance)
      .pipe(tap((response) => this.session.set(response)));
  }

  /**
   * Asks for a new access token with the refresh cookie. Parallel callers share one request; the
   * observable emits the new token, or null when the server refuses (the session is then dropped).
   */
  refresh(): Observable<string | null> {
    this.refreshInFlight ??= this.http.post<SessionResponse>('/api/auth/refresh', {}).pipe(
      tap((response) => this.session.set(response)),
      map((response) => response.accessToken),
      catchError(() => {
        this.session.set(null);
        return of(null);
      }),
      finalize(() => (this.refreshInFlight = null)),
      shareReplay({ bufferSize: 1, refCount: false }),
    );
    return this.refreshInFlight;
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
    this.session.set(null);
    const keep = returnUrl && !returnUrl.startsWith('/sign-in') && returnUrl !== '/';
    void this.router.navigate(['/sign-in'], keep ? { queryParams: { returnUrl } } : {});
  }
}

import { HttpClient } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { Router } from '@angular/router';
import { Observable, tap } from 'rxjs';
import type { User } from './system-summary';

const STORAGE_KEY = 'cellwarden.session';

interface SignInResponse {
  accessToken: string;
  expiresIn: number;
  user: User;
}

interface StoredSession {
  accessToken: string;
  user: User;
  expiresAt: number;
}

/** The signed-in session: the user and the access token (memory + sessionStorage). */
@Injectable({ providedIn: 'root' })
export class Auth {
  private readonly http = inject(HttpClient);
  private readonly router = inject(Router);
  private readonly session = signal<StoredSession | null>(readStoredSession());

  /** The signed-in user, or null. */
  readonly currentUser = computed(() => this.session()?.user ?? null);
  /** The bearer token for API calls, or null. */
  readonly accessToken = computed(() => this.session()?.accessToken ?? null);
  /** Whether someone is signed in. */
  readonly isSignedIn = computed(() => this.session() !== null);

  /** Signs in with e-mail and password; errors come through as HttpErrorResponse. */
  signIn(email: string, password: string): Observable<SignInResponse> {
    return this.http
      .post<SignInResponse>('/api/auth/sign-in', { email, password })
      .pipe(tap((response) => this.store(response)));
  }

  /** Forgets the session and goes to the sign-in page. */
  signOut(): void {
    this.session.set(null);
    sessionStorage.removeItem(STORAGE_KEY);
    void this.router.navigate(['/sign-in']);
  }

  private store(response: SignInResponse): void {
    const session: StoredSession = {
      accessToken: response.accessToken,
      user: response.user,
      expiresAt: Date.now() + response.expiresIn * 1000,
    };
    this.session.set(session);
    sessionStorage.setItem(STORAGE_KEY, JSON.stringify(session));
  }
}

function readStoredSession(): StoredSession | null {
  try {
    const raw = sessionStorage.getItem(STORAGE_KEY);
    if (!raw) return null;
    const session = JSON.parse(raw) as StoredSession;
    return session.expiresAt > Date.now() ? session : null;
  } catch {
    return null;
  }
}

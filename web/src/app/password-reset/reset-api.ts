import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { PasswordResetCompletion, PasswordResetRequest } from '@cellwarden/shared';
import { Observable, map } from 'rxjs';

/** The two password-reset calls. */
@Injectable({ providedIn: 'root' })
export class ResetApi {
  private readonly http = inject(HttpClient);

  /** Asks for a reset link by e-mail; the server answers 202 whether or not the address is known. */
  requestReset(body: PasswordResetRequest): Observable<void> {
    return this.http.post('/api/auth/password-reset/request', body).pipe(map(() => undefined));
  }

  /** Sets the new password with the token from the e-mail (204). */
  completeReset(body: PasswordResetCompletion): Observable<void> {
    return this.http.post('/api/auth/password-reset/complete', body).pipe(map(() => undefined));
  }
}

import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { InvitationPreview } from '@cellwarden/shared';
import { Observable, map } from 'rxjs';

/** Reads an invitation before it is accepted (accepting is on `Auth`, since it starts a session). */
@Injectable({ providedIn: 'root' })
export class InvitationApi {
  private readonly http = inject(HttpClient);

  /** What the invitation behind `token` is for. */
  preview(token: string): Observable<InvitationPreview> {
    return this.http
      .get<InvitationPreview | { invitation: InvitationPreview }>(
        `/api/auth/invitations/${encodeURIComponent(token)}`,
      )
      .pipe(map((body) => ('invitation' in body ? body.invitation : body)));
  }
}

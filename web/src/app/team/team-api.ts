import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { CompanyMember, Invitation, InvitationRequest } from '@cellwarden/shared';
import { Observable, map } from 'rxjs';

/** The admin's company calls: members and invitations. */
@Injectable({ providedIn: 'root' })
export class TeamApi {
  private readonly http = inject(HttpClient);

  /** Everyone in the admin's company. */
  members(): Observable<CompanyMember[]> {
    return this.http
      .get<{ members: CompanyMember[] }>('/api/company/members')
      .pipe(map((body) => body.members));
  }

  /** Invitations sent, pending or accepted. */
  invitations(): Observable<Invitation[]> {
    return this.http
      .get<{ invitations: Invitation[] }>('/api/company/invitations')
      .pipe(map((body) => body.invitations));
  }

  /** Invites a person by e-mail with the given roles (201). */
  invite(request: InvitationRequest): Observable<Invitation> {
    return this.http
      .post<Invitation | { invitation: Invitation }>('/api/company/invitations', request)
      .pipe(map((body) => ('invitation' in body ? body.invitation : body)));
  }

  /** Takes a member out of the company; their sessions end at once. */
  removeMember(userId: string): Observable<void> {
    return this.http.delete<void>(`/api/company/members/${encodeURIComponent(userId)}`);
  }

  /** Withdraws an open invitation: its link stops working. */
  withdrawInvitation(invitationId: string): Observable<void> {
    return this.http.delete<void>(`/api/company/invitations/${encodeURIComponent(invitationId)}`);
  }
}

import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type {
  AccessRequestApproval,
  Grant,
  IncomingAccessRequest,
  NewAccessRequest,
  OutgoingAccessRequest,
  ShareCode,
} from '@cellwarden/shared';
import { Observable, map } from 'rxjs';
import { systemPath } from './api';

const requestPath = (id: string, action: string) =>
  `/api/access-requests/${encodeURIComponent(id)}/${action}`;

/** Support people's access requests, the owner's answers, and share codes. */
@Injectable({ providedIn: 'root' })
export class RequestsApi {
  private readonly http = inject(HttpClient);

  /** Asks an owner for access; the answer says only that the request was sent. */
  ask(request: NewAccessRequest): Observable<OutgoingAccessRequest> {
    return this.http
      .post<{ request: OutgoingAccessRequest }>('/api/access-requests', request)
      .pipe(map((body) => body.request));
  }

  /** The requests I made, newest first. */
  outgoing(): Observable<OutgoingAccessRequest[]> {
    return this.http
      .get<{ requests: OutgoingAccessRequest[] }>('/api/access-requests/outgoing')
      .pipe(map((body) => body.requests));
  }

  /** Pending requests on the systems I own; one system's when `systemId` is given. */
  incoming(systemId?: string): Observable<IncomingAccessRequest[]> {
    const path = systemId ? systemPath(systemId, '/access-requests') : '/api/access-requests/incoming';
    return this.http.get<{ requests: IncomingAccessRequest[] }>(path).pipe(map((body) => body.requests));
  }

  /** Approves with a scope and an end: the requester gets an ordinary grant. */
  approve(id: string, approval: AccessRequestApproval): Observable<Grant> {
    return this.http
      .post<{ grant: Grant }>(requestPath(id, 'approve'), approval)
      .pipe(map((body) => body.grant));
  }

  decline(id: string): Observable<void> {
    return this.http.post(requestPath(id, 'decline'), {}).pipe(map(() => undefined));
  }

  /** A new share code for the system (earlier unused ones stop working). */
  shareCode(systemId: string): Observable<ShareCode> {
    return this.http.post<ShareCode>(systemPath(systemId, '/share-codes'), {});
  }
}

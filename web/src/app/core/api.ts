import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import type { HistoryPoint, SystemSummary, User } from './system-summary';

/** Typed client for the Cellwarden REST API. */
@Injectable({ providedIn: 'root' })
export class Api {
  private readonly http = inject(HttpClient);

  /** The signed-in user according to the server. */
  me(): Observable<User> {
    return this.http.get<{ user: User }>('/api/auth/me').pipe(map((body) => body.user));
  }

  /** The systems the user may see. */
  systems(): Observable<SystemSummary[]> {
    return this.http.get<{ systems: SystemSummary[] }>('/api/systems').pipe(map((body) => body.systems));
  }

  /** One system by id. */
  system(id: string): Observable<SystemSummary> {
    return this.http
      .get<{ system: SystemSummary }>(`/api/systems/${encodeURIComponent(id)}`)
      .pipe(map((body) => body.system));
  }

  /** Stored readings of one system between two instants. */
  readings(id: string, from: Date, to: Date): Observable<HistoryPoint[]> {
    const params = new HttpParams().set('from', from.toISOString()).set('to', to.toISOString());
    return this.http
      .get<{ resolution: string; points: HistoryPoint[] }>(
        `/api/systems/${encodeURIComponent(id)}/readings`,
        {
          params,
        },
      )
      .pipe(map((body) => body.points ?? []));
  }
}

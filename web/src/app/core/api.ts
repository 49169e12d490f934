import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { fromHistoryColumns, type HistoryColumns, type SystemStatus } from '@cellwarden/shared';
import { Observable, map } from 'rxjs';
import type { HistoryPoint, SystemSummary, User } from './system-summary';

/** GET /api/systems/:id/readings: points downsampled to `resolution` (e.g. "raw", "1m", "1h"). */
export interface ReadingHistory {
  resolution: string;
  points: HistoryPoint[];
}

/** The path of one system's resource, id escaped. */
export function systemPath(id: string, rest = ''): string {
  return `/api/systems/${encodeURIComponent(id)}${rest}`;
}

/** Query parameters for a time range, as ISO 8601 instants. */
export function rangeParams(from: Date, to: Date): HttpParams {
  return new HttpParams().set('from', from.toISOString()).set('to', to.toISOString());
}

/** Typed client for the systems and readings endpoints of the Cellwarden REST API. */
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
    return this.http.get<{ system: SystemSummary }>(systemPath(id)).pipe(map((body) => body.system));
  }

  /** The latest reading, the derived state and the active alerts of one system. */
  status(id: string): Observable<SystemStatus> {
    return this.http
      .get<{ status: SystemStatus }>(systemPath(id, '/status'))
      .pipe(map((body) => body.status));
  }

  /** Stored readings of one system between two instants, downsampled by the server. */
  readings(id: string, from: Date, to: Date): Observable<ReadingHistory> {
    return this.http
      .get<{ resolution: string; columns: HistoryColumns }>(systemPath(id, '/readings'), {
        params: rangeParams(from, to),
      })
      .pipe(map((body) => ({ resolution: body.resolution, points: fromHistoryColumns(body.columns) })));
  }
}

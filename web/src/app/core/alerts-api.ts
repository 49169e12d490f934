import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { AlertAcknowledgement, AlertEvent, AlertsResponse } from '@cellwarden/shared';
import { Observable, map } from 'rxjs';
import { systemPath } from './api';

/** Which alerts of a system to list. */
export interface AlertQuery {
  from?: Date;
  to?: Date;
  /** Only flags that are still active. */
  active?: boolean;
}

/** Typed client for the alert endpoints (GET /api/systems/:id/alerts, POST …/acknowledge). */
@Injectable({ providedIn: 'root' })
export class AlertsApi {
  private readonly http = inject(HttpClient);

  /** The recorded alerts of one system, optionally within a range. */
  alerts(systemId: string, query: AlertQuery = {}): Observable<AlertEvent[]> {
    let params = new HttpParams();
    if (query.from) params = params.set('from', query.from.toISOString());
    if (query.to) params = params.set('to', query.to.toISOString());
    if (query.active) params = params.set('active', 'true');
    return this.http
      .get<AlertsResponse>(systemPath(systemId, '/alerts'), { params })
      .pipe(map((body) => body.alerts ?? []));
  }

  /** Acknowledges one alert with a note; answers the updated alert. */
  acknowledge(systemId: string, alertId: string, note: string): Observable<AlertEvent> {
    const body: AlertAcknowledgement = { note };
    return this.http.post<AlertEvent>(
      systemPath(systemId, `/alerts/${encodeURIComponent(alertId)}/acknowledge`),
      body,
    );
  }
}

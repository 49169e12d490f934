import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, LOCALE_ID, inject } from '@angular/core';
import type { BatteryHealthResponse } from '@cellwarden/shared';
import type { Observable } from 'rxjs';
import { systemPath } from '../core/api';
import { Preferences } from '../core/preferences';
import type { TemperatureUnit } from '../core/temperature-unit';

/** A health report's file format. */
export type HealthReportFormat = 'pdf' | 'csv';

/** The battery-health endpoints of one system: the screen's figures and the report downloads. */
@Injectable({ providedIn: 'root' })
export class BatteryHealthApi {
  private readonly http = inject(HttpClient);
  private readonly locale = inject(LOCALE_ID);
  private readonly preferences = inject(Preferences);

  /** Capacity trend, life-cycle figures and plain words, the words in the viewer's locale and unit. */
  health(id: string, unit: TemperatureUnit): Observable<BatteryHealthResponse> {
    return this.http.get<BatteryHealthResponse>(systemPath(id, '/battery-health'), {
      params: new HttpParams().set('locale', this.locale).set('unit', unit),
    });
  }

  /** The report of [from, to) as a file (the server records the download in the audit). */
  report(id: string, format: HealthReportFormat, from: Date, to: Date): Observable<Blob> {
    const params = new HttpParams()
      .set('from', from.toISOString())
      .set('to', to.toISOString())
      .set('locale', this.locale)
      .set('unit', this.preferences.temperatureUnit());
    return this.http.get(systemPath(id, `/battery-health/report.${format}`), {
      params,
      responseType: 'blob',
    });
  }
}

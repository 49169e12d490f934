import { HttpClient, HttpEvent, HttpHeaders } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import { rangeParams, systemPath } from '../core/api';

/** What POST /api/systems/:id/readings/import answers when every row was valid. */
export interface ReadingsImportResult {
  rows: number;
  stored: number;
  duplicates: number;
}

/** The readings CSV of one system: download a range, upload a file (all rows stored or none). */
@Injectable({ providedIn: 'root' })
export class ReadingsTransferApi {
  private readonly http = inject(HttpClient);

  /** The readings between two instants as CSV, with download progress (the server streams it by day). */
  exportCsv(systemId: string, from: Date, to: Date): Observable<HttpEvent<Blob>> {
    return this.http.get(systemPath(systemId, '/readings.csv'), {
      params: rangeParams(from, to),
      responseType: 'blob',
      reportProgress: true,
      observe: 'events',
    });
  }

  /** Sends a CSV file as text/csv (whatever type the browser guessed for it), with upload progress. */
  importCsv(systemId: string, file: Blob): Observable<HttpEvent<{ import: ReadingsImportResult }>> {
    return this.http.post<{ import: ReadingsImportResult }>(systemPath(systemId, '/readings/import'), file, {
      headers: new HttpHeaders({ 'Content-Type': 'text/csv' }),
      reportProgress: true,
      observe: 'events',
    });
  }
}

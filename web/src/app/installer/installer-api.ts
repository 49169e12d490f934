import { HttpClient, HttpEvent } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type {
  CommissioningCheck,
  CommissioningCheckRequest,
  SystemSettings,
  UploadListing,
} from '@cellwarden/shared';
import { Observable, map } from 'rxjs';

const systemPath = (systemId: string) => `/api/systems/${encodeURIComponent(systemId)}`;

/** Commissioning checks, the commissioning record and uploads of one system. */
@Injectable({ providedIn: 'root' })
export class InstallerApi {
  private readonly http = inject(HttpClient);

  /** The system's settings, for its charge sources and their ratings. */
  settings(systemId: string): Observable<SystemSettings> {
    return this.http
      .get<{ settings: SystemSettings }>(`${systemPath(systemId)}/settings`)
      .pipe(map((body) => body.settings));
  }

  /** Past and running checks, newest first. */
  checks(systemId: string): Observable<CommissioningCheck[]> {
    return this.http
      .get<{ checks: CommissioningCheck[] }>(`${systemPath(systemId)}/commissioning-checks`)
      .pipe(map((body) => body.checks));
  }

  /** One check, to follow its progress. */
  check(systemId: string, checkId: string): Observable<CommissioningCheck> {
    return this.http
      .get<{ check: CommissioningCheck }>(
        `${systemPath(systemId)}/commissioning-checks/${encodeURIComponent(checkId)}`,
      )
      .pipe(map((body) => body.check));
  }

  /** Starts a check; it runs on the server while readings arrive. */
  startCheck(systemId: string, request: CommissioningCheckRequest): Observable<CommissioningCheck> {
    return this.http
      .post<CommissioningCheck | { check: CommissioningCheck }>(
        `${systemPath(systemId)}/commissioning-checks`,
        request,
      )
      .pipe(map((body) => ('check' in body ? body.check : body)));
  }

  /** The commissioning record as a PDF (fetched with the bearer token, so not a plain link). */
  recordPdf(systemId: string): Observable<Blob> {
    return this.http.get(`${systemPath(systemId)}/commissioning-record.pdf`, { responseType: 'blob' });
  }

  /** Sends the commissioning record to the system's owner. */
  emailRecord(systemId: string): Observable<void> {
    return this.http
      .post(`${systemPath(systemId)}/commissioning-record/email`, {})
      .pipe(map(() => undefined));
  }

  /** Photos and logs of the system. */
  uploads(systemId: string): Observable<UploadListing[]> {
    return this.http
      .get<{ uploads: UploadListing[] }>(`${systemPath(systemId)}/uploads`)
      .pipe(map((body) => body.uploads));
  }

  /** Uploads one file (multipart field `file`, plus `caption` and `kind`), reporting progress events. */
  upload(
    systemId: string,
    file: File,
    caption: string,
    kind: UploadListing['kind'],
  ): Observable<HttpEvent<unknown>> {
    const body = new FormData();
    body.append('file', file, file.name);
    body.append('caption', caption);
    body.append('kind', kind);
    return this.http.post(`${systemPath(systemId)}/uploads`, body, {
      reportProgress: true,
      observe: 'events',
    });
  }
}

import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type {
  AuditEntry,
  CompanyListing,
  DeviceCredentials,
  DeviceListing,
  DeviceRequest,
  Grant,
  GrantRequest,
} from '@cellwarden/shared';
import { Observable, map } from 'rxjs';

const systemPath = (systemId: string) => `/api/systems/${encodeURIComponent(systemId)}`;

/** Grants, devices and the audit trail of one system, and the grants given to me. */
@Injectable({ providedIn: 'root' })
export class AccessApi {
  private readonly http = inject(HttpClient);

  /** Every grant of a system, active or not (owner only). */
  grants(systemId: string): Observable<Grant[]> {
    return this.http
      .get<{ grants: Grant[] }>(`${systemPath(systemId)}/grants`)
      .pipe(map((body) => body.grants));
  }

  /** Grants a company or a person access until a time in the future. */
  grantAccess(systemId: string, request: GrantRequest): Observable<Grant> {
    return this.http
      .post<Grant | { grant: Grant }>(`${systemPath(systemId)}/grants`, request)
      .pipe(map((body) => ('grant' in body ? body.grant : body)));
  }

  /** Revokes a grant at once (204). */
  revokeGrant(systemId: string, grantId: string): Observable<void> {
    return this.http
      .delete(`${systemPath(systemId)}/grants/${encodeURIComponent(grantId)}`)
      .pipe(map(() => undefined));
  }

  /** Grants given to the signed-in person or their company. */
  receivedGrants(): Observable<Grant[]> {
    return this.http.get<{ grants: Grant[] }>('/api/grants/received').pipe(map((body) => body.grants));
  }

  /** Companies an owner may grant access to. */
  companies(): Observable<CompanyListing[]> {
    return this.http
      .get<{ companies: CompanyListing[] }>('/api/companies')
      .pipe(map((body) => body.companies));
  }

  /** The battery monitors attached to a system. */
  devices(systemId: string): Observable<DeviceListing[]> {
    return this.http
      .get<{ devices: DeviceListing[] }>(`${systemPath(systemId)}/devices`)
      .pipe(map((body) => body.devices));
  }

  /** Adds a device; the answer holds its MQTT secret, which is never shown again. */
  addDevice(systemId: string, request: DeviceRequest): Observable<DeviceCredentials> {
    return this.http.post<DeviceCredentials>(`${systemPath(systemId)}/devices`, request);
  }

  /** Issues a new MQTT secret for a device; the old one stops working. */
  rotateDevice(systemId: string, deviceId: string): Observable<DeviceCredentials> {
    return this.http.post<DeviceCredentials>(
      `${systemPath(systemId)}/devices/${encodeURIComponent(deviceId)}/rotate`,
      {},
    );
  }

  /** Revokes a device: the broker refuses it from now on (204). */
  revokeDevice(systemId: string, deviceId: string): Observable<void> {
    return this.http
      .delete(`${systemPath(systemId)}/devices/${encodeURIComponent(deviceId)}`)
      .pipe(map(() => undefined));
  }

  /** Who did what with the system, newest first. */
  audit(systemId: string): Observable<AuditEntry[]> {
    return this.http
      .get<{ entries: AuditEntry[] }>(`${systemPath(systemId)}/audit`)
      .pipe(map((body) => body.entries));
  }
}

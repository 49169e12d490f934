import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type {
  CreatedSystem,
  DeviceCredentials,
  DeviceRequest,
  MonitorStatus,
  NewSystemRequest,
  SystemHandover,
} from '@cellwarden/shared';
import { Observable, map } from 'rxjs';
import { systemPath } from './api';

/** Setting up a system, accepting one set up for me, and a new monitor's first reading. */
@Injectable({ providedIn: 'root' })
export class OnboardingApi {
  private readonly http = inject(HttpClient);

  /** Creates a system (an installer names the customer who will own it). */
  createSystem(request: NewSystemRequest): Observable<CreatedSystem> {
    return this.http.post<CreatedSystem>('/api/systems', request);
  }

  /** Systems set up for me that wait for me to accept them. */
  handovers(): Observable<SystemHandover[]> {
    return this.http
      .get<{ handovers: SystemHandover[] }>('/api/handovers')
      .pipe(map((body) => body.handovers));
  }

  /** Becomes the owner of a system set up for me. */
  acceptHandover(id: string): Observable<{ systemId: string }> {
    return this.http.post<{ systemId: string }>(`/api/handovers/${encodeURIComponent(id)}/accept`, {});
  }

  /** Adds a battery monitor; the answer holds its secret, which the server never sends again. */
  addMonitor(systemId: string, request: DeviceRequest): Observable<DeviceCredentials> {
    return this.http.post<DeviceCredentials>(systemPath(systemId, '/devices'), request);
  }

  /** Whether a monitor's first reading has arrived, or why the broker refused it. */
  monitorStatus(systemId: string, deviceId: string): Observable<MonitorStatus> {
    return this.http.get<MonitorStatus>(
      systemPath(systemId, `/devices/${encodeURIComponent(deviceId)}/status`),
    );
  }

  /** The owner ends the installer company's rights on their system (204). */
  removeInstaller(systemId: string): Observable<void> {
    return this.http.delete(systemPath(systemId, '/installer')).pipe(map(() => undefined));
  }
}

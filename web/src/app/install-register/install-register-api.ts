import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type {
  CircuitDesignVsMeasured,
  CircuitWiring,
  ComponentRatings,
  InstallRegister,
  RecordCheckChoice,
  RegisterCircuit,
  RegisterComponent,
} from '@cellwarden/shared';
import { Observable, map } from 'rxjs';

const installPath = (systemId: string) => `/api/systems/${encodeURIComponent(systemId)}/install`;

/** A system's install register, its measured currents and the commissioning record's choice of checks. */
@Injectable({ providedIn: 'root' })
export class InstallRegisterApi {
  private readonly http = inject(HttpClient);

  /** Components, circuits with their verdicts, and the budget from the components. */
  register(systemId: string): Observable<InstallRegister> {
    return this.http
      .get<{ register: InstallRegister }>(installPath(systemId))
      .pipe(map((body) => body.register));
  }

  /** Adds a component, or replaces the one with `componentId`. */
  saveComponent(
    systemId: string,
    body: { name: string; ratings: ComponentRatings },
    componentId?: string,
  ): Observable<RegisterComponent> {
    const url = `${installPath(systemId)}/components`;
    const request = componentId
      ? this.http.put<{ component: RegisterComponent }>(`${url}/${encodeURIComponent(componentId)}`, body)
      : this.http.post<{ component: RegisterComponent }>(url, body);
    return request.pipe(map((response) => response.component));
  }

  removeComponent(systemId: string, componentId: string): Observable<void> {
    return this.http
      .delete(`${installPath(systemId)}/components/${encodeURIComponent(componentId)}`)
      .pipe(map(() => undefined));
  }

  /** Adds a circuit, or replaces the one with `circuitId`; answers it with its verdict. */
  saveCircuit(systemId: string, wiring: CircuitWiring, circuitId?: string): Observable<RegisterCircuit> {
    const url = `${installPath(systemId)}/circuits`;
    const request = circuitId
      ? this.http.put<{ circuit: RegisterCircuit }>(`${url}/${encodeURIComponent(circuitId)}`, wiring)
      : this.http.post<{ circuit: RegisterCircuit }>(url, wiring);
    return request.pipe(map((response) => response.circuit));
  }

  removeCircuit(systemId: string, circuitId: string): Observable<void> {
    return this.http
      .delete(`${installPath(systemId)}/circuits/${encodeURIComponent(circuitId)}`)
      .pipe(map(() => undefined));
  }

  /** Each monitored circuit's measured peak and 99th percentile against its ratings, over `days`. */
  measured(systemId: string, days: number): Observable<CircuitDesignVsMeasured[]> {
    return this.http
      .get<{ circuits: CircuitDesignVsMeasured[] }>(`${installPath(systemId)}/measured`, {
        params: new HttpParams().set('days', days),
      })
      .pipe(map((body) => body.circuits));
  }

  /** The checks the record may carry, and which it carries by default. */
  recordChoices(systemId: string): Observable<RecordCheckChoice[]> {
    return this.http
      .get<{
        choices: RecordCheckChoice[];
      }>(`/api/systems/${encodeURIComponent(systemId)}/commissioning-record/choices`)
      .pipe(map((body) => body.choices));
  }

  /** The record with exactly the chosen checks. */
  recordPdf(systemId: string, checkIds: readonly string[]): Observable<Blob> {
    return this.http.get(`/api/systems/${encodeURIComponent(systemId)}/commissioning-record.pdf`, {
      params: new HttpParams().set('checks', checkIds.join(',')),
      responseType: 'blob',
    });
  }
}

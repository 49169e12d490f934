import type { AlertEvent } from '@cellwarden/shared';
import { Observable, catchError, map, of, startWith } from 'rxjs';
import { AlertsApi } from '../core/alerts-api';
import { Api, ReadingHistory } from '../core/api';
import { ApiProblem, apiProblem } from '../core/api-error';
import type { TimeRange } from './time-range';

/** Loading, failed, or loaded. */
export type Load<T> =
  { phase: 'loading' } | { phase: 'error'; problem: ApiProblem } | { phase: 'ready'; value: T };

function asLoad<T>(source: Observable<T>): Observable<Load<T>> {
  return source.pipe(
    map((value): Load<T> => ({ phase: 'ready', value })),
    catchError((error: unknown) => of<Load<T>>({ phase: 'error', problem: apiProblem(error) })),
    startWith<Load<T>>({ phase: 'loading' }),
  );
}

/** The downsampled readings of a range. */
export function historyReadings(api: Api, id: string, range: TimeRange): Observable<Load<ReadingHistory>> {
  return asLoad(api.readings(id, new Date(range.from), new Date(range.to)));
}

/** The alerts that overlap a range. */
export function historyAlerts(api: AlertsApi, id: string, range: TimeRange): Observable<Load<AlertEvent[]>> {
  return asLoad(api.alerts(id, { from: new Date(range.from), to: new Date(range.to) }));
}

/** Words for the server's downsampling resolution ("raw", "1m", "1h", "1d"). */
export function resolutionText(resolution: string): string {
  const match = /^(\d+)([smhd])$/.exec(resolution);
  if (!match) return resolution === 'raw' ? 'every stored reading' : resolution;
  const units = { s: 'second', m: 'minute', h: 'hour', d: 'day' } as const;
  const count = Number(match[1]);
  const unit = units[match[2] as keyof typeof units];
  return `one point per ${count === 1 ? unit : `${count} ${unit}s`}`;
}

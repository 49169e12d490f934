import type { SystemSettings, SystemStatus, SystemSummary } from '@cellwarden/shared';
import { Observable, catchError, concat, filter, map, merge, of, scan, takeWhile } from 'rxjs';
import { Api } from '../core/api';
import { apiProblem } from '../core/api-error';
import { LiveStream, SystemStreamEvent } from '../core/live-stream';
import { LoadState, toLoadState } from '../core/load-state';
import { SettingsApi } from '../core/settings-api';
import { LiveState, applyStreamEvent, seedLiveState } from './live-state';
import { ChartPoint, appendWithin } from './to-chart-series';

/** How far back the live chart reaches. */
export const LIVE_WINDOW_MS = 3 * 60 * 60 * 1000;
/** At most this many points stay in the live chart (3 h at one reading every 5 s is 2160). */
export const LIVE_MAX_POINTS = 2400;

/** Loading, failed, or the live state. */
export type LiveLoad = LoadState<LiveState>;

/** The system's description, or 'missing' when it cannot be seen. */
export function systemOrMissing(api: Api, id: string): Observable<SystemSummary | 'missing'> {
  return api.system(id).pipe(catchError(() => of('missing' as const)));
}

type LiveStep = { kind: 'seed'; status: SystemStatus } | { kind: 'event'; event: SystemStreamEvent };
/** The state once the status has arrived (null before), and the stream events that came ahead of it. */
type Folding = { state: LiveState | null; early: SystemStreamEvent[] };

/**
 * The status, then every stream event folded in; stops listening once access ends. The stream is subscribed
 * at the same time as the status is asked for (not after it), so the socket opens while the status is on its
 * way; events arriving first wait for it and are folded in after it.
 */
export function liveStates(api: Api, stream: LiveStream, id: string): Observable<LiveLoad> {
  const states = merge(
    api.status(id).pipe(map((status): LiveStep => ({ kind: 'seed', status }))),
    stream.events(id).pipe(map((event): LiveStep => ({ kind: 'event', event }))),
  ).pipe(
    scan(foldLiveStep, { state: null, early: [] }),
    filter((folding): folding is { state: LiveState; early: [] } => folding.state !== null),
    map((folding) => folding.state),
    takeWhile((state) => !state.accessEnded, true),
  );
  // The server's own message, whatever it is.
  return toLoadState(states, (error) => apiProblem(error).message);
}

/** One step of `liveStates`: exported for its spec. */
export function foldLiveStep(folding: Folding, step: LiveStep): Folding {
  if (step.kind === 'seed') {
    // A reading no newer than the status's own is ignored by applyStreamEvent, as it is later.
    return { state: folding.early.reduce(applyStreamEvent, seedLiveState(step.status)), early: [] };
  }
  if (folding.state) return { state: applyStreamEvent(folding.state, step.event), early: [] };
  return { state: null, early: [...folding.early, step.event] };
}

/**
 * The last hours of voltage and current: stored readings (the lead monitor's, as the server picks them), then each
 * live one that `fromShownMonitor` accepts appended, so a second monitor of the bank never zigzags into the line.
 */
export function liveChartPoints(
  api: Api,
  stream: LiveStream,
  id: string,
  fromShownMonitor: (deviceId: string | undefined) => boolean = () => true,
): Observable<ChartPoint[]> {
  const to = new Date();
  const from = new Date(to.getTime() - LIVE_WINDOW_MS);
  const stored = api.readings(id, from, to).pipe(
    map((history) => history.points),
    catchError(() => of([] as ChartPoint[])),
  );
  return concat(
    stored.pipe(map((points) => ({ kind: 'seed' as const, points }))),
    stream.readings(id).pipe(
      filter((reading) => fromShownMonitor(reading.deviceId)),
      map((reading) => ({ kind: 'live' as const, reading })),
    ),
  ).pipe(
    scan<{ kind: 'seed'; points: ChartPoint[] } | { kind: 'live'; reading: ChartPoint }, ChartPoint[]>(
      (points, step) =>
        step.kind === 'seed'
          ? step.points.slice(-LIVE_MAX_POINTS)
          : appendWithin(points, pick(step.reading), LIVE_WINDOW_MS, LIVE_MAX_POINTS),
      [],
    ),
  );
}

/** The system's settings (charge source labels, time zone, usable capacity); null when they cannot be read. */
export function systemSettings(api: SettingsApi, id: string): Observable<SystemSettings | null> {
  return api.settings(id).pipe(catchError(() => of(null)));
}

function pick(reading: ChartPoint): ChartPoint {
  // Only what the chart plots, so the window does not hold whole readings.
  return { measuredAt: reading.measuredAt, voltage: reading.voltage, current: reading.current };
}

import type { SystemSettings, SystemStatus, SystemSummary } from '@cellwarden/shared';
import { Observable, catchError, concat, filter, map, merge, of, scan, takeWhile } from 'rxjs';
import { Api } from '../core/api';
import { apiProblem } from '../core/api-error';
import { LiveStream, SystemStreamEvent } from '../core/live-stream';
import { LoadState, toLoadState } from '../core/load-state';
import { SettingsApi } from '../core/settings-api';
import { EMPTY_LIVE_STATE, LiveState, applyStreamEvent, seedLiveState } from './live-state';
import { ChartPoint, appendWithin } from './to-chart-series';

/** How far back the live chart reaches. */
export const LIVE_WINDOW_MS = 3 * 60 * 60 * 1000;
/** At most this many points stay in the live chart (3 h at one reading every 5 s is 2160). */
export const LIVE_MAX_POINTS = 2400;

/** Loading, failed, or the live state. */
export type LiveLoad = LoadState<LiveState>;

/** The system's description, or 'missing' when it cannot be seen. */
export function systemOrMissing(api: Pick<Api, 'system'>, id: string): Observable<SystemSummary | 'missing'> {
  return api.system(id).pipe(catchError(() => of('missing' as const)));
}

type LiveStep = { kind: 'seed'; status: SystemStatus } | { kind: 'event'; event: SystemStreamEvent };
/**
 * The state so far (null until the status or a first reading is in), the stream events that came ahead of the
 * status, and whether the status is in.
 */
type Folding = { state: LiveState | null; early: SystemStreamEvent[]; seeded: boolean };

/**
 * The status, then every stream event folded in; stops listening once access ends. The stream is subscribed
 * at the same time as the status is asked for (not after it), so the socket opens while the status is on its
 * way. Whichever comes first is shown first: a reading from the stream before the status is shown on its own,
 * and once the status arrives the early events are folded in after it.
 */
export function liveStates(
  api: Pick<Api, 'status'>,
  stream: Pick<LiveStream, 'events'>,
  id: string,
): Observable<LiveLoad> {
  const states = merge(
    api.status(id).pipe(map((status): LiveStep => ({ kind: 'seed', status }))),
    stream.events(id).pipe(map((event): LiveStep => ({ kind: 'event', event }))),
  ).pipe(
    scan(foldLiveStep, { state: null, early: [], seeded: false }),
    map((folding) => folding.state),
    filter((state): state is LiveState => state !== null),
    takeWhile((state) => !state.accessEnded, true),
  );
  // The server's own message, whatever it is.
  return toLoadState(states, (error) => apiProblem(error).message);
}

/** One step of `liveStates`: exported for its spec. */
export function foldLiveStep(folding: Folding, step: LiveStep): Folding {
  if (step.kind === 'seed') {
    // A reading no newer than the status's own is ignored by applyStreamEvent, as it is later.
    const state = folding.early.reduce(applyStreamEvent, seedLiveState(step.status));
    return { state, early: [], seeded: true };
  }
  if (folding.seeded) return { ...folding, state: applyStreamEvent(folding.state!, step.event) };
  const early = [...folding.early, step.event];
  // Until the status names the bank's lead monitor, the first reading shows, as in the chart; an alert alone
  // waits for the status, which lists the other flags too.
  const shown = early.some((e) => e.type !== 'alert');
  return { state: shown ? early.reduce(applyStreamEvent, EMPTY_LIVE_STATE) : null, early, seeded: false };
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

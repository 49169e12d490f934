import { InjectionToken } from '@angular/core';
import type { SessionResponse, SystemStatus, SystemSummary } from '@cellwarden/shared';

/** The answer to the renewal web/src/session-head-start.js sent: the HTTP status (0 without a connection). */
export interface SessionHeadStartAnswer {
  status: number;
  /** The session when the status is 2xx, else null. */
  body: SessionResponse | null;
}

// The global the head-start script sets; read once, then removed, so no later service takes it again.
const GLOBAL_NAME = 'cwSessionHeadStart';

/** Takes the renewal the page started before Angular ran, if there is one (at most once per page load). */
export function takeSessionHeadStart(): Promise<SessionHeadStartAnswer> | null {
  const holder = globalThis as { [GLOBAL_NAME]?: Promise<SessionHeadStartAnswer> };
  const started = holder[GLOBAL_NAME] ?? null;
  delete holder[GLOBAL_NAME];
  return started;
}

/** The renewal already on its way when the app started, or null (then Auth sends its own). */
export const SESSION_HEAD_START = new InjectionToken<Promise<SessionHeadStartAnswer> | null>(
  'SESSION_HEAD_START',
  { providedIn: 'root', factory: takeSessionHeadStart },
);

/** The answer to the status request the head-start script sent on a live view (0 without a connection). */
export interface StatusHeadStartAnswer {
  status: number;
  /** GET /api/systems/:id/status's body when the status is 2xx, else null. */
  body: { status: SystemStatus } | null;
}

const STATUS_GLOBAL_NAME = 'cwStatusHeadStart';
const SYSTEM_GLOBAL_NAME = 'cwSystemHeadStart';

/** Takes the status request the page started for `systemId`, if there is one (at most once per page load). */
export function takeStatusHeadStart(systemId: string): Promise<StatusHeadStartAnswer> | null {
  return takeSystemRequest(STATUS_GLOBAL_NAME, systemId);
}

/** How the live head start takes over that status request; replaced in tests. */
export const STATUS_HEAD_START = new InjectionToken<
  (systemId: string) => Promise<StatusHeadStartAnswer> | null
>('STATUS_HEAD_START', { providedIn: 'root', factory: () => takeStatusHeadStart });

/** The answer to GET /api/systems/:id the head-start script sent on a live view (0 without a connection). */
export interface SystemHeadStartAnswer {
  status: number;
  /** The body when the status is 2xx, else null. */
  body: { system: SystemSummary } | null;
}

/** Takes the system's description the page asked for, if it is `systemId`'s (at most once per page load). */
export function takeSystemHeadStart(systemId: string): Promise<SystemHeadStartAnswer> | null {
  return takeSystemRequest(SYSTEM_GLOBAL_NAME, systemId);
}

/** How the live head start takes over that request; replaced in tests. */
export const SYSTEM_HEAD_START = new InjectionToken<
  (systemId: string) => Promise<SystemHeadStartAnswer> | null
>('SYSTEM_HEAD_START', { providedIn: 'root', factory: () => takeSystemHeadStart });

// A request the script started for one system, read once and removed (a request for another system is dropped).
function takeSystemRequest<T>(name: string, systemId: string): Promise<T> | null {
  const holder = globalThis as unknown as Record<
    string,
    { systemId: string; answer: Promise<T> } | undefined
  >;
  const started = holder[name];
  delete holder[name];
  return started?.systemId === systemId ? started.answer : null;
}

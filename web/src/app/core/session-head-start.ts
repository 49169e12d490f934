import { InjectionToken } from '@angular/core';
import type { SessionResponse, SystemStatus } from '@cellwarden/shared';

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

/** Takes the status request the page started for `systemId`, if there is one (at most once per page load). */
export function takeStatusHeadStart(systemId: string): Promise<StatusHeadStartAnswer> | null {
  const holder = globalThis as {
    [STATUS_GLOBAL_NAME]?: { systemId: string; answer: Promise<StatusHeadStartAnswer> };
  };
  const started = holder[STATUS_GLOBAL_NAME];
  delete holder[STATUS_GLOBAL_NAME];
  return started?.systemId === systemId ? started.answer : null;
}

/** How the live head start takes over that status request; replaced in tests. */
export const STATUS_HEAD_START = new InjectionToken<
  (systemId: string) => Promise<StatusHeadStartAnswer> | null
>('STATUS_HEAD_START', { providedIn: 'root', factory: () => takeStatusHeadStart });

import { HttpErrorResponse } from '@angular/common/http';
import type { ApiErrorBody } from '@cellwarden/shared';

/** An API failure as the screens show it. */
export interface ApiProblem {
  status: number;
  code: string;
  message: string;
  /** The form field the server blames, when it names one. */
  field?: string;
}

/** Code of a problem caused by the person no longer being allowed to see the system. */
export const ACCESS_ENDED = 'access-ended';

/** What a person is told when a system they were looking at is no longer theirs to see. */
export const ACCESS_ENDED_MESSAGE =
  'Your access to this system has ended. Ask the owner for a new grant if you still need it.';

// The access rule answers 404 for a system one may no longer view (so its existence is not told); reached
// from the dashboard's own links, that means the grant ended or was revoked, not a network fault.
const SYSTEM_PATH = /\/api\/systems\/[^/?#]+/;

/** Reads `{ error: { code, message, field? } }` from a failed call, with a plain fallback message. */
export function apiProblem(error: unknown): ApiProblem {
  if (!(error instanceof HttpErrorResponse)) {
    return { status: 0, code: 'unexpected', message: 'Something went wrong. Try again.' };
  }
  if (error.status === 404 && SYSTEM_PATH.test(error.url ?? '')) {
    return { status: 404, code: ACCESS_ENDED, message: ACCESS_ENDED_MESSAGE };
  }
  const body = (error.error as Partial<ApiErrorBody> | null)?.error;
  if (body?.message)
    return { status: error.status, code: body.code, message: body.message, field: body.field };
  const message =
    error.status === 0
      ? 'The server could not be reached. Check the connection and try again.'
      : `The server answered ${error.status}. Try again in a moment.`;
  return { status: error.status, code: `http-${error.status}`, message };
}

/**
 * What a screen says when its data did not load: the ended access or the lost connection when that is the
 * cause, else `fallback` (what could not be loaded and what to try).
 */
export function loadFailureText(problem: ApiProblem, fallback: string): string {
  if (problem.code === ACCESS_ENDED) return problem.message;
  if (problem.status === 0 && problem.code !== 'unexpected') return problem.message;
  return fallback;
}

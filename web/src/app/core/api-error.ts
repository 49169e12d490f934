import { HttpErrorResponse } from '@angular/common/http';
import type { AbstractControl, FormGroup } from '@angular/forms';
import type { ApiErrorBody } from '@cellwarden/shared';
import { blobText } from './blob-files';

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

/** What a failed API call means for a form: the message, and the field it belongs under (if any). */
export interface ServerError {
  message: string;
  field: string | null;
}

/** The body of a failed call as a form shows it (read by `apiProblem`), or the form's own fallback. */
export function serverErrorOf(error: unknown, fallback: string): ServerError {
  const problem = apiProblem(error);
  if (problem.code !== 'unexpected' && !String(problem.code).startsWith('http-'))
    return { message: problem.message, field: problem.field ?? null };
  if (problem.status === 0 && error instanceof HttpErrorResponse)
    return { message: 'The server cannot be reached. Check the connection and try again.', field: null };
  return { message: fallback, field: null };
}

/**
 * Puts the server's message under the form control its `field` names (as the `server` error, cleared
 * on the next edit) and returns null; returns the message when no control matches, for a form-level alert.
 */
export function showServerError(form: FormGroup, error: ServerError): string | null {
  const control: AbstractControl | null = error.field ? form.get(error.field) : null;
  if (!control) return error.message;
  control.setErrors({ ...control.errors, server: error.message });
  control.markAsTouched();
  return null;
}

/**
 * The problem of a failed CSV call. A download asked for a Blob, so its `{ error }` body arrives as a Blob and
 * is read as JSON here before `apiProblem` looks at it.
 */
export async function transferProblem(error: unknown): Promise<ApiProblem> {
  if (error instanceof HttpErrorResponse && error.error instanceof Blob) {
    let body: unknown = null;
    try {
      body = JSON.parse(await blobText(error.error));
    } catch {
      // Not our JSON (a proxy's page): apiProblem falls back to the status.
    }
    return apiProblem(
      new HttpErrorResponse({
        error: body,
        status: error.status,
        statusText: error.statusText,
        url: error.url ?? undefined,
      }),
    );
  }
  return apiProblem(error);
}

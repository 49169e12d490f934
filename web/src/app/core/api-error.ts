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

/** Reads `{ error: { code, message, field? } }` from a failed call, with a plain fallback message. */
export function apiProblem(error: unknown): ApiProblem {
  if (!(error instanceof HttpErrorResponse)) {
    return { status: 0, code: 'unexpected', message: 'Something went wrong. Try again.' };
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

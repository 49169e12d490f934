import { HttpErrorResponse } from '@angular/common/http';
import type { AbstractControl, FormGroup } from '@angular/forms';
import { apiProblem } from '../core/api-error';

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

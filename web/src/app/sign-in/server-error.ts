import { HttpErrorResponse } from '@angular/common/http';
import type { AbstractControl, FormGroup } from '@angular/forms';
import type { ApiErrorBody } from '@cellwarden/shared';

/** What a failed API call means for a form: the message, and the field it belongs under (if any). */
export interface ServerError {
  message: string;
  field: string | null;
}

/** Reads the `{ error: { code, message, field? } }` body of a failed call, or says what else went wrong. */
export function serverErrorOf(error: unknown, fallback: string): ServerError {
  if (error instanceof HttpErrorResponse) {
    const body = error.error as Partial<ApiErrorBody> | null;
    if (body?.error?.message) return { message: body.error.message, field: body.error.field ?? null };
    if (error.status === 0) {
      return { message: 'The server cannot be reached. Check the connection and try again.', field: null };
    }
  }
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

import { HttpErrorResponse } from '@angular/common/http';
import { FormControl, FormGroup } from '@angular/forms';
import { serverErrorOf, showServerError } from './server-error';

describe('serverErrorOf and showServerError', () => {
  const refusal = new HttpErrorResponse({
    status: 422,
    error: { error: { code: 'invalid', message: 'expiresAt must be in the future', field: 'expiresAt' } },
  });

  it("reads the message and field of the API's error body", () => {
    expect(serverErrorOf(refusal, 'x')).toEqual({
      message: 'expiresAt must be in the future',
      field: 'expiresAt',
    });
  });

  it('says the server cannot be reached on a network failure', () => {
    expect(serverErrorOf(new HttpErrorResponse({ status: 0 }), 'x').message).toContain('cannot be reached');
  });

  it('falls back to the given text for anything else', () => {
    expect(serverErrorOf(new Error('boom'), 'Saving failed.')).toEqual({
      message: 'Saving failed.',
      field: null,
    });
  });

  it('puts the message under the named control and returns nothing for the form', () => {
    const form = new FormGroup({ expiresAt: new FormControl('') });
    expect(showServerError(form, serverErrorOf(refusal, 'x'))).toBeNull();
    expect(form.controls.expiresAt.getError('server')).toBe('expiresAt must be in the future');
  });

  it('returns the message for a form-level alert when no control matches', () => {
    const form = new FormGroup({ email: new FormControl('') });
    expect(showServerError(form, { message: 'Too many attempts.', field: null })).toBe('Too many attempts.');
  });
});

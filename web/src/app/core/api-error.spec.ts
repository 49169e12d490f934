import { HttpErrorResponse } from '@angular/common/http';
import { FormControl, FormGroup } from '@angular/forms';
import {
  ACCESS_ENDED,
  apiProblem,
  loadFailureText,
  serverErrorOf,
  showServerError,
  transferProblem,
} from './api-error';

describe('apiProblem', () => {
  it('reads the message and the field from the API error body', () => {
    const error = new HttpErrorResponse({
      status: 400,
      error: {
        error: {
          code: 'usable-above-rated',
          message: 'usable must be ≤ rated; got 250',
          field: 'battery.usableCapacityAh',
        },
      },
    });
    expect(apiProblem(error)).toEqual({
      status: 400,
      code: 'usable-above-rated',
      message: 'usable must be ≤ rated; got 250',
      field: 'battery.usableCapacityAh',
    });
  });

  it('says the server could not be reached when there is no answer', () =>
    expect(apiProblem(new HttpErrorResponse({ status: 0 })).message).toContain('could not be reached'));

  it('names the status when the body is not an API error', () =>
    expect(apiProblem(new HttpErrorResponse({ status: 502, error: '<html>' })).message).toContain('502'));

  it('gives a plain message for anything else', () =>
    expect(apiProblem(new Error('x')).code).toBe('unexpected'));
});

describe('access that has ended', () => {
  const gone = new HttpErrorResponse({
    status: 404,
    url: '/api/systems/van-1/settings',
    error: { error: { code: 'not_found', message: 'System not found' } },
  });

  it('reads a 404 for a system as access that has ended, not a connection problem', () => {
    const problem = apiProblem(gone);
    expect(problem.code).toBe(ACCESS_ENDED);
    expect(problem.message).toContain('Your access to this system has ended');
    expect(problem.message).not.toContain('connection');
  });

  it('keeps other 404s as the server worded them', () =>
    expect(
      apiProblem(
        new HttpErrorResponse({
          status: 404,
          url: '/api/invitations/x',
          error: { error: { code: 'not_found', message: 'Invitation not found' } },
        }),
      ).message,
    ).toBe('Invitation not found'));

  it('lets a screen say so in place of its own failure text', () => {
    expect(loadFailureText(apiProblem(gone), 'The alerts could not be loaded.')).toContain('has ended');
    expect(loadFailureText(apiProblem(new HttpErrorResponse({ status: 0 })), 'x')).toContain(
      'could not be reached',
    );
    expect(
      loadFailureText(apiProblem(new HttpErrorResponse({ status: 500 })), 'The alerts could not be loaded.'),
    ).toBe('The alerts could not be loaded.');
  });
});

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

describe('transferProblem', () => {
  it('reads the server’s error out of a Blob body', async () => {
    const body = new Blob([
      JSON.stringify({ error: { code: 'invalid_input', message: 'from must be before to', field: 'from' } }),
    ]);
    const problem = await transferProblem(new HttpErrorResponse({ error: body, status: 400, url: '/x' }));
    expect(problem).toEqual({
      status: 400,
      code: 'invalid_input',
      message: 'from must be before to',
      field: 'from',
    });
  });
});

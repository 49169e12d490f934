import { HttpErrorResponse } from '@angular/common/http';
import { ACCESS_ENDED, apiProblem, loadFailureText } from './api-error';

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

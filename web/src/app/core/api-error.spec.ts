import { HttpErrorResponse } from '@angular/common/http';
import { apiProblem } from './api-error';

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

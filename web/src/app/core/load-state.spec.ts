import { HttpErrorResponse } from '@angular/common/http';
import { Subject, firstValueFrom, of, throwError, toArray } from 'rxjs';
import { ACCESS_ENDED_MESSAGE } from './api-error';
import { LoadState, dataFailure, loadError, loadedOr, toLoadState } from './load-state';

const coded = new HttpErrorResponse({
  status: 409,
  url: '/api/team',
  error: { error: { code: 'conflict', message: 'That address is already a member.' } },
});
const ended = new HttpErrorResponse({ status: 404, url: '/api/systems/van-1/alerts' });

describe('toLoadState', () => {
  it('starts loading, then carries the value', async () =>
    expect(await firstValueFrom(toLoadState(of(42), 'Could not load.').pipe(toArray()))).toEqual([
      { status: 'loading' },
      { status: 'loaded', value: 42 },
    ]));

  it('shows loading until the answer arrives', () => {
    const answer = new Subject<number>();
    const states: LoadState<number>[] = [];
    toLoadState(answer, 'Could not load.').subscribe((s) => states.push(s));
    expect(states).toEqual([{ status: 'loading' }]);
  });

  it('with a fallback text, shows the server’s own message when it gives one', async () =>
    expect(
      await firstValueFrom(
        toLoadState(
          throwError(() => coded),
          'Could not load.',
        ).pipe(toArray()),
      ),
    ).toContainEqual({ status: 'error', message: 'That address is already a member.' }));

  it('with a wording function, lets the screen word the failure', async () =>
    expect(
      await firstValueFrom(
        toLoadState(
          throwError(() => coded),
          dataFailure('The alerts could not be loaded.'),
        ).pipe(toArray()),
      ),
    ).toContainEqual({ status: 'error', message: 'The alerts could not be loaded.' }));
});

describe('dataFailure', () => {
  it('says so when the person’s access to the system has ended', () =>
    expect(dataFailure('The alerts could not be loaded.')(ended)).toBe(ACCESS_ENDED_MESSAGE));

  it('says the server cannot be reached when the connection is lost', () =>
    expect(dataFailure('x')(new HttpErrorResponse({ status: 0, url: '/api/x' }))).toMatch(
      /could not be reached/,
    ));
});

describe('loadedOr and loadError', () => {
  it('read the value or the message of a state', () => {
    expect(loadedOr({ status: 'loaded', value: [1] }, [])).toEqual([1]);
    expect(loadedOr({ status: 'loading' }, [])).toEqual([]);
    expect(loadError({ status: 'error', message: 'no' })).toBe('no');
    expect(loadError({ status: 'loaded', value: 1 })).toBeNull();
  });
});

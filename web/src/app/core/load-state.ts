import { Observable, catchError, map, of, startWith } from 'rxjs';
import { serverErrorOf } from './api-error';

/** A screen's data while it loads, once it arrived, or why it did not. */
export type LoadState<T> =
  { status: 'loading' } | { status: 'error'; message: string } | { status: 'loaded'; value: T };

/** Wraps a one-shot request so a template can show loading, error and loaded states. */
export function toLoadState<T>(source: Observable<T>, failure: string): Observable<LoadState<T>> {
  return source.pipe(
    map((value): LoadState<T> => ({ status: 'loaded', value })),
    catchError((error: unknown) =>
      of<LoadState<T>>({ status: 'error', message: serverErrorOf(error, failure).message }),
    ),
    startWith<LoadState<T>>({ status: 'loading' }),
  );
}

/** The loaded value, or `fallback` while loading or after an error. */
export function loadedOr<T>(state: LoadState<T>, fallback: T): T {
  return state.status === 'loaded' ? state.value : fallback;
}

/** The error message, or null. */
export function loadError(state: LoadState<unknown>): string | null {
  return state.status === 'error' ? state.message : null;
}

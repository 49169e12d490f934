import { ErrorHandler, Injectable, Injector, inject } from '@angular/core';

/** Logs unexpected errors and tells the user something went wrong instead of failing silently. */
@Injectable()
export class GlobalErrorHandler implements ErrorHandler {
  private readonly injector = inject(Injector);

  handleError(error: unknown): void {
    console.error(error);
    // The snack bar loads with the first error, not with the app.
    void import('@angular/material/snack-bar').then(({ MatSnackBar }) =>
      this.injector
        .get(MatSnackBar)
        .open('Something went wrong. Reload the page if values stop updating.', 'Dismiss', {
          duration: 8000,
        }),
    );
  }
}

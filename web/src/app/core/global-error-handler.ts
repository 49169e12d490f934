import { ErrorHandler, Injectable, inject } from '@angular/core';
import { MatSnackBar } from '@angular/material/snack-bar';

/** Logs unexpected errors and tells the user something went wrong instead of failing silently. */
@Injectable()
export class GlobalErrorHandler implements ErrorHandler {
  private readonly snackBar = inject(MatSnackBar);

  handleError(error: unknown): void {
    console.error(error);
    this.snackBar.open('Something went wrong. Reload the page if values stop updating.', 'Dismiss', {
      duration: 8000,
    });
  }
}

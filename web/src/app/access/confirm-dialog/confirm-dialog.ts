import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MAT_DIALOG_DATA, MatDialog, MatDialogModule } from '@angular/material/dialog';
import { MatButtonModule } from '@angular/material/button';
import { Observable, map } from 'rxjs';

/** What a confirmation asks. */
export interface ConfirmRequest {
  title: string;
  message: string;
  confirmLabel: string;
}

/** A yes/no dialog for actions that cannot be undone (revoke, rotate). */
@Component({
  selector: 'cw-confirm-dialog',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatDialogModule, MatButtonModule],
  template: `
    <h2 mat-dialog-title>{{ data.title }}</h2>
    <mat-dialog-content
      ><p>{{ data.message }}</p></mat-dialog-content
    >
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="false">Cancel</button>
      <button mat-flat-button type="button" [mat-dialog-close]="true">{{ data.confirmLabel }}</button>
    </mat-dialog-actions>
  `,
})
export class ConfirmDialog {
  protected readonly data = inject<ConfirmRequest>(MAT_DIALOG_DATA);
}

/** Opens the confirmation and emits once: true only if the person confirmed. */
export function confirmAction(dialog: MatDialog, request: ConfirmRequest): Observable<boolean> {
  return dialog
    .open<ConfirmDialog, ConfirmRequest, boolean>(ConfirmDialog, {
      data: request,
      width: '420px',
      maxWidth: '95vw',
    })
    .afterClosed()
    .pipe(map((answer) => answer === true));
}

import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTableModule } from '@angular/material/table';
import type { Grant } from '@cellwarden/shared';
import { combineLatest, filter, switchMap } from 'rxjs';
import { serverErrorOf } from '../../core/api-error';
import { AccessApi } from '../../core/access-api';
import { confirmAction } from '../confirm-dialog/confirm-dialog';
import { GrantForm } from '../grant-form/grant-form';
import { grantState, granteeName } from '../../core/grant-state';
import { LoadState, loadedOr, toLoadState } from '../../core/load-state';

/** The owner's view of who may see a system: the grants table, revoke, and the grant form. */
@Component({
  selector: 'cw-grants',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatTableModule, MatButtonModule, MatProgressSpinnerModule, DatePipe, GrantForm],
  templateUrl: './grants.html',
  styleUrl: '../access-tables.scss',
})
export class Grants {
  private readonly api = inject(AccessApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);

  /** The system whose grants these are. */
  readonly systemId = input.required<string>();

  private readonly reloads = signal(0);
  protected readonly columns = ['grantee', 'access', 'expires', 'state', 'actions'];
  protected readonly state = toSignal(
    combineLatest([toObservable(this.systemId), toObservable(this.reloads)]).pipe(
      switchMap(([id]) => toLoadState(this.api.grants(id), 'The grants could not be loaded.')),
    ),
    { initialValue: { status: 'loading' } as LoadState<Grant[]> },
  );
  protected readonly rows = computed(() =>
    loadedOr(this.state(), []).map((grant) => ({
      grant,
      grantee: granteeName(grant),
      state: grantState(grant, Date.now()),
    })),
  );

  protected reload(): void {
    this.reloads.update((n) => n + 1);
  }

  protected revokeGrant(grant: Grant): void {
    const name = granteeName(grant);
    confirmAction(this.dialog, {
      title: 'Revoke access?',
      message: `${name} loses access to ${grant.systemName} at once. This cannot be undone; grant again if needed.`,
      confirmLabel: 'Revoke',
    })
      .pipe(
        filter(Boolean),
        switchMap(() => this.api.revokeGrant(this.systemId(), grant.id)),
      )
      .subscribe({
        next: () => this.reload(),
        error: (error: unknown) =>
          this.snackBar.open(serverErrorOf(error, 'The grant could not be revoked.').message, 'Dismiss'),
      });
  }
}

import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTableModule } from '@angular/material/table';
import type { DeviceCredentials, DeviceListing } from '@cellwarden/shared';
import { combineLatest, filter, switchMap } from 'rxjs';
import { serverErrorOf, showServerError } from '../../core/api-error';
import { AccessApi } from '../../core/access-api';
import { confirmAction } from '../confirm-dialog/confirm-dialog';
import { DeviceCredentialsDialog } from '../device-credentials/device-credentials';
import { DEVICE_ID_PATTERN } from '../../core/device-id';
import { LoadState, loadError, toLoadState } from '../../core/load-state';

/** The monitors that publish for a system: list, add (secret shown once), rotate, revoke. */
@Component({
  selector: 'cw-devices',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    ReactiveFormsModule,
    MatTableModule,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MatProgressSpinnerModule,
    DatePipe,
  ],
  templateUrl: './devices.html',
  styleUrl: '../access-tables.scss',
})
export class Devices {
  private readonly api = inject(AccessApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);

  /** The system the devices belong to. */
  readonly systemId = input.required<string>();

  private readonly reloads = signal(0);
  protected readonly columns = ['label', 'id', 'lastSeen', 'state', 'actions'];
  protected readonly state = toSignal(
    combineLatest([toObservable(this.systemId), toObservable(this.reloads)]).pipe(
      switchMap(([id]) =>
        toLoadState(this.api.devices(id), 'The devices could not be loaded. Reload to try again.'),
      ),
    ),
    { initialValue: { status: 'loading' } as LoadState<DeviceListing[]> },
  );
  protected readonly form = inject(FormBuilder).nonNullable.group({
    id: ['', [Validators.required, Validators.pattern(DEVICE_ID_PATTERN)]],
    label: ['', [Validators.required, Validators.maxLength(80)]],
  });
  /** Why the list did not load: the server's reason (no device rights, access ended) or the connection. */
  protected readonly loadError = loadError;
  protected readonly submitting = signal(false);
  protected readonly serverError = signal<string | null>(null);

  protected addDevice(): void {
    this.serverError.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.submitting.set(true);
    const { id, label } = this.form.getRawValue();
    this.api.addDevice(this.systemId(), { id, label: label.trim() }).subscribe({
      next: (credentials) => {
        this.submitting.set(false);
        this.form.reset();
        this.showCredentials(credentials);
      },
      error: (error: unknown) => {
        this.submitting.set(false);
        this.serverError.set(
          showServerError(this.form, serverErrorOf(error, 'The device could not be added.')),
        );
      },
    });
  }

  protected rotateDevice(device: DeviceListing): void {
    confirmAction(this.dialog, {
      title: 'Rotate the secret?',
      message: `${device.label} stops connecting until its new secret is entered in the monitor.`,
      confirmLabel: 'Rotate',
    })
      .pipe(
        filter(Boolean),
        switchMap(() => this.api.rotateDevice(this.systemId(), device.id)),
      )
      .subscribe({
        next: (credentials) => this.showCredentials(credentials),
        error: (error: unknown) => this.tell(error, 'The secret could not be rotated.'),
      });
  }

  protected revokeDevice(device: DeviceListing): void {
    confirmAction(this.dialog, {
      title: 'Revoke this device?',
      message: `${device.label} can no longer send readings. This cannot be undone; add it again to reconnect.`,
      confirmLabel: 'Revoke',
    })
      .pipe(
        filter(Boolean),
        switchMap(() => this.api.revokeDevice(this.systemId(), device.id)),
      )
      .subscribe({
        next: () => this.reloads.update((n) => n + 1),
        error: (error: unknown) => this.tell(error, 'The device could not be revoked.'),
      });
  }

  private showCredentials(credentials: DeviceCredentials): void {
    this.reloads.update((n) => n + 1);
    // The secret leaves memory when the dialog closes: nothing else keeps a reference to it.
    this.dialog.open(DeviceCredentialsDialog, {
      data: credentials,
      disableClose: true,
      width: '520px',
      maxWidth: '95vw',
    });
  }

  private tell(error: unknown, fallback: string): void {
    this.snackBar.open(serverErrorOf(error, fallback).message, 'Dismiss');
  }
}

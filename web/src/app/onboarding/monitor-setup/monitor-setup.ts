import { ClipboardModule } from '@angular/cdk/clipboard';
import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { monitorExample, type DeviceCredentials, type MonitorStatus } from '@cellwarden/shared';
import { EMPTY, catchError, switchMap, takeWhile, timer } from 'rxjs';
import { DEVICE_ID_PATTERN } from '../../core/device-id';
import { DateTimePipe } from '../../core/date-time-pipe';
import { TemperaturePipe } from '../../core/temperature-pipe';
import { serverErrorOf, showServerError } from '../../core/api-error';
import { OnboardingApi } from '../../core/onboarding-api';
import { CredentialList, type CredentialRow } from '../../core/credential-list/credential-list';
import { monitorWords } from './monitor-words';

/** How often the waiting screen asks whether the first reading has come. */
const STATUS_POLL_MS = 2000;

/** Adds a system's battery monitor, shows its credentials once with an example, then waits for its first reading. */
@Component({
  selector: 'cw-monitor-setup',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    ReactiveFormsModule,
    ClipboardModule,
    MatFormFieldModule,
    MatInputModule,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    RouterLink,
    DecimalPipe,
    DateTimePipe,
    TemperaturePipe,
    CredentialList,
  ],
  templateUrl: './monitor-setup.html',
  styleUrl: './monitor-setup.scss',
})
export class MonitorSetup {
  private readonly onboarding = inject(OnboardingApi);

  /** The system the monitor reports on. */
  readonly systemId = input.required<string>();
  /** Its nominal voltage, for a plausible example reading. */
  readonly nominalVoltage = input<number>(12);

  protected readonly form = inject(FormBuilder).nonNullable.group({
    id: ['', [Validators.required, Validators.pattern(DEVICE_ID_PATTERN)]],
    label: ['Battery monitor', [Validators.required, Validators.maxLength(80)]],
  });
  protected readonly submitting = signal(false);
  protected readonly serverError = signal<string | null>(null);
  protected readonly copied = signal<string | null>(null);
  /** The credentials, held only while this screen is open: the server never sends the secret again. */
  protected readonly credentials = signal<DeviceCredentials | null>(null);

  protected readonly rows = computed<CredentialRow[]>(() => {
    const c = this.credentials();
    if (!c) return [];
    return [
      { label: 'Broker URL', value: c.brokerUrl },
      { label: 'Client id and username', value: c.mqttUsername },
      { label: 'Password', value: c.mqttPassword },
      { label: 'Topic to publish to', value: c.mqttTopic },
    ];
  });
  protected readonly example = computed(() => {
    const c = this.credentials();
    return c
      ? monitorExample(
          { brokerUrl: c.brokerUrl, deviceId: c.mqttUsername, password: c.mqttPassword },
          this.nominalVoltage(),
        )
      : null;
  });
  protected readonly status = toSignal(
    toObservable(this.credentials).pipe(
      switchMap((c) =>
        c
          ? timer(0, STATUS_POLL_MS).pipe(
              switchMap(() =>
                this.onboarding.monitorStatus(this.systemId(), c.device.id).pipe(catchError(() => EMPTY)),
              ),
              takeWhile((s: MonitorStatus) => s.state !== 'arrived', true),
            )
          : EMPTY,
      ),
    ),
    { initialValue: null },
  );
  protected readonly words = computed(() => monitorWords(this.status()));

  protected addMonitor(): void {
    this.serverError.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.submitting.set(true);
    const { id, label } = this.form.getRawValue();
    this.onboarding.addMonitor(this.systemId(), { id, label: label.trim() }).subscribe({
      next: (credentials) => {
        this.submitting.set(false);
        this.credentials.set(credentials);
      },
      error: (error: unknown) => {
        this.submitting.set(false);
        this.serverError.set(
          showServerError(this.form, serverErrorOf(error, 'The monitor could not be added.')),
        );
      },
    });
  }

  protected markCopied(label: string, done: boolean): void {
    this.copied.set(done ? label : null);
  }
}

import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import {
  AWG_SIZES,
  AwgSize,
  ChargeSource,
  CommissioningCheck,
  CommissioningCheckRequest,
} from '@cellwarden/shared';
import { catchError, map, of, switchMap } from 'rxjs';
import { serverErrorOf, showServerError } from '../../../core/api-error';
import { InstallerApi } from '../../installer-api';

/** The "start a check" form (CommissioningCheckRequest), offering the system's charge sources. */
@Component({
  selector: 'cw-check-form',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatButtonModule],
  templateUrl: './check-form.html',
  styleUrl: './check-form.scss',
})
export class CheckForm {
  private readonly api = inject(InstallerApi);

  /** The system to check. */
  readonly systemId = input.required<string>();
  /** Whether a check is already running (the form waits). */
  readonly busy = input(false);
  /** Emits the started check. */
  readonly started = output<CommissioningCheck>();

  protected readonly gauges = AWG_SIZES;
  protected readonly sources = toSignal(
    toObservable(this.systemId).pipe(
      switchMap((id) => this.api.settings(id)),
      map((settings): ChargeSource[] => settings.chargeSources),
      catchError(() => of<ChargeSource[]>([])),
    ),
    { initialValue: [] },
  );
  protected readonly hasSources = computed(() => this.sources().length > 0);
  protected readonly form = inject(FormBuilder).group({
    sourceId: ['', Validators.required],
    ratedCurrentA: [null as number | null, [Validators.required, Validators.min(0.1), Validators.max(1000)]],
    tolerancePercent: [10 as number | null, [Validators.min(1), Validators.max(50)]],
    windowSeconds: [300 as number | null, [Validators.required, Validators.min(60), Validators.max(1800)]],
    sourceOutputVoltage: [null as number | null, [Validators.min(0), Validators.max(70)]],
    batteryTerminalVoltage: [null as number | null, [Validators.min(0), Validators.max(70)]],
    gauge: ['' as AwgSize | ''],
    oneWayLengthM: [null as number | null, [Validators.min(0.1), Validators.max(100)]],
  });
  protected readonly submitting = signal(false);
  protected readonly serverError = signal<string | null>(null);

  constructor() {
    // Picking a fitted source fills in its rating; the installer may still overwrite it.
    this.form.controls.sourceId.valueChanges.pipe(takeUntilDestroyed()).subscribe((id) => {
      const source = this.sources().find((s) => s.id === id);
      if (source) this.form.controls.ratedCurrentA.setValue(source.ratedCurrentA);
    });
  }

  protected startCheck(): void {
    this.serverError.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.submitting.set(true);
    this.api.startCheck(this.systemId(), this.toRequest()).subscribe({
      next: (check) => {
        this.submitting.set(false);
        this.started.emit(check);
      },
      error: (error: unknown) => {
        this.submitting.set(false);
        this.serverError.set(
          showServerError(this.form, serverErrorOf(error, 'The check could not be started.')),
        );
      },
    });
  }

  private toRequest(): CommissioningCheckRequest {
    const v = this.form.getRawValue();
    const optional = (value: number | null) => (value === null ? undefined : value);
    return {
      sourceId: v.sourceId ?? '',
      ratedCurrentA: v.ratedCurrentA ?? 0,
      windowSeconds: v.windowSeconds ?? 0,
      tolerancePercent: optional(v.tolerancePercent),
      sourceOutputVoltage: optional(v.sourceOutputVoltage),
      batteryTerminalVoltage: optional(v.batteryTerminalVoltage),
      gauge: v.gauge ? v.gauge : undefined,
      oneWayLengthM: optional(v.oneWayLengthM),
    };
  }
}

import { BreakpointObserver } from '@angular/cdk/layout';
import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal, viewChild } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormBuilder, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatAutocompleteModule } from '@angular/material/autocomplete';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import { MatStepper, MatStepperModule } from '@angular/material/stepper';
import { RouterLink } from '@angular/router';
import type { CreatedSystem, NewSystemRequest } from '@cellwarden/shared';
import { map } from 'rxjs';
import { Auth } from '../../core/auth';
import { serverErrorOf, showServerError } from '../../core/api-error';
import { MonitorSetup } from '../monitor-setup/monitor-setup';
import { OnboardingApi } from '../../core/onboarding-api';
import { browserTimeZone, knownTimeZones, matchingZones, oneOfZones, withinRatings } from './system-form';

/** Route systems/new: set up a system step by step (battery, BMS, owner), then its monitor and first reading. */
@Component({
  selector: 'cw-new-system',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    ReactiveFormsModule,
    RouterLink,
    DatePipe,
    MatStepperModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatRadioModule,
    MatButtonModule,
    MatButtonToggleModule,
    MatAutocompleteModule,
    MatIconModule,
    MonitorSetup,
  ],
  templateUrl: './new-system.html',
  styleUrl: './new-system.scss',
})
export class NewSystem {
  private readonly api = inject(OnboardingApi);
  private readonly auth = inject(Auth);
  private readonly fb = inject(FormBuilder).nonNullable;
  private readonly stepper = viewChild(MatStepper);

  protected readonly isPhone = toSignal(
    inject(BreakpointObserver)
      .observe('(max-width: 599.98px)')
      .pipe(map((state) => state.matches)),
    { initialValue: false },
  );
  /** An installer of a company sets a system up for a customer; anyone else for themselves. */
  protected readonly forCustomer = computed(
    () => this.auth.hasAnyRole(['installer']) && !!this.auth.currentUser()?.companyId,
  );
  private readonly zones = knownTimeZones();

  protected readonly battery = this.fb.group(
    {
      name: ['', [Validators.required, Validators.maxLength(120)]],
      kind: ['van' as NewSystemRequest['kind'], Validators.required],
      nominalVoltage: [12 as NewSystemRequest['nominalVoltage'], Validators.required],
      chemistry: ['lifepo4' as NewSystemRequest['chemistry'], Validators.required],
      ratedCapacityAh: [
        null as number | null,
        [Validators.required, Validators.min(0.1), Validators.max(10000)],
      ],
      usableCapacityAh: [
        null as number | null,
        [Validators.required, Validators.min(0.1), Validators.max(10000)],
      ],
      timeZone: [browserTimeZone(), [Validators.required, oneOfZones(this.zones)]],
    },
    { validators: withinRatings },
  );
  protected readonly bms = this.fb.group(
    {
      bmsContinuousDischargeA: [
        null as number | null,
        [Validators.required, Validators.min(0.1), Validators.max(5000)],
      ],
      bmsPeakDischargeA: [
        null as number | null,
        [Validators.required, Validators.min(0.1), Validators.max(5000)],
      ],
      coldChargeCutoff: [null as boolean | null, Validators.required],
    },
    { validators: withinRatings },
  );
  protected readonly owner = this.fb.group({ ownerEmail: [''] });

  protected readonly zoneTyped = toSignal(this.battery.controls.timeZone.valueChanges, {
    initialValue: this.battery.controls.timeZone.value,
  });
  protected readonly zoneOptions = computed(() => matchingZones(this.zones, this.zoneTyped() ?? ''));
  protected readonly submitting = signal(false);
  protected readonly serverError = signal<string | null>(null);
  protected readonly created = signal<CreatedSystem | null>(null);

  constructor() {
    if (this.forCustomer())
      this.owner.controls.ownerEmail.setValidators([
        Validators.required,
        Validators.email,
        Validators.maxLength(254),
      ]);
  }

  protected createSystem(): void {
    this.serverError.set(null);
    const groups = [this.battery, this.bms, this.owner] as FormGroup[];
    if (groups.some((g) => g.invalid)) {
      groups.forEach((g) => g.markAllAsTouched());
      return;
    }
    this.submitting.set(true);
    this.api.createSystem(this.toRequest()).subscribe({
      next: (created) => {
        this.submitting.set(false);
        this.created.set(created);
        // The next step is the monitor; the steps before it are done and stay done.
        setTimeout(() => this.stepper()?.next());
      },
      error: (error: unknown) => {
        this.submitting.set(false);
        const problem = serverErrorOf(error, 'The system could not be set up.');
        const index = groups.findIndex((g) => problem.field && g.get(problem.field));
        if (index >= 0) this.stepper()!.selectedIndex = index;
        this.serverError.set(index >= 0 ? showServerError(groups[index], problem) : problem.message);
      },
    });
  }

  private toRequest(): NewSystemRequest {
    const b = this.battery.getRawValue();
    const p = this.bms.getRawValue();
    const email = this.owner.getRawValue().ownerEmail.trim();
    return {
      name: b.name.trim(),
      kind: b.kind,
      nominalVoltage: Number(b.nominalVoltage) as NewSystemRequest['nominalVoltage'],
      chemistry: b.chemistry,
      ratedCapacityAh: b.ratedCapacityAh!,
      usableCapacityAh: b.usableCapacityAh!,
      bmsContinuousDischargeA: p.bmsContinuousDischargeA!,
      bmsPeakDischargeA: p.bmsPeakDischargeA!,
      coldChargeCutoff: p.coldChargeCutoff!,
      timeZone: b.timeZone,
      ...(this.forCustomer() && email ? { ownerEmail: email } : {}),
    };
  }
}

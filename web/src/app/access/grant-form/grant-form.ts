import { ChangeDetectionStrategy, Component, inject, input, output, signal } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { FormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { Grant, GrantAccess, GrantRequest } from '@cellwarden/shared';
import { catchError, of } from 'rxjs';
import { serverErrorOf, showServerError } from '../../core/api-error';
import { AccessApi } from '../../core/access-api';
import { EXPIRY_QUICK_PICKS, expiryInDays, futureInstant } from '../../core/grant-expiry';

type GranteeKind = 'company' | 'person';

/** The "grant access" form: a company or a person's e-mail, view or configure, until when. */
@Component({
  selector: 'cw-grant-form',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    ReactiveFormsModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatButtonToggleModule,
  ],
  templateUrl: './grant-form.html',
  styleUrl: './grant-form.scss',
})
export class GrantForm {
  private readonly api = inject(AccessApi);

  /** The system to grant access to. */
  readonly systemId = input.required<string>();
  /** Emits the new grant once the server stored it. */
  readonly granted = output<Grant>();

  protected readonly quickPicks = EXPIRY_QUICK_PICKS;
  protected readonly companies = toSignal(this.api.companies().pipe(catchError(() => of(null))), {
    initialValue: [],
  });
  protected readonly form = inject(FormBuilder).nonNullable.group({
    granteeKind: ['company' as GranteeKind],
    granteeCompanyId: ['', Validators.required],
    granteeEmail: [''],
    access: ['view' as GrantAccess, Validators.required],
    expiresAt: ['', [Validators.required, futureInstant(() => Date.now())]],
  });
  protected readonly submitting = signal(false);
  protected readonly serverError = signal<string | null>(null);

  constructor() {
    this.form.controls.granteeKind.valueChanges
      .pipe(takeUntilDestroyed())
      .subscribe((kind) => this.requireGrantee(kind));
  }

  protected pickExpiry(days: number): void {
    this.form.controls.expiresAt.setValue(expiryInDays(days, Date.now()));
    this.form.controls.expiresAt.markAsTouched();
  }

  protected grantAccess(): void {
    this.serverError.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.submitting.set(true);
    this.api.grantAccess(this.systemId(), this.toRequest()).subscribe({
      next: (grant) => {
        this.submitting.set(false);
        this.form.reset();
        this.granted.emit(grant);
      },
      error: (error: unknown) => {
        this.submitting.set(false);
        this.serverError.set(
          showServerError(this.form, serverErrorOf(error, 'The grant could not be saved.')),
        );
      },
    });
  }

  private requireGrantee(kind: GranteeKind): void {
    const { granteeCompanyId, granteeEmail } = this.form.controls;
    granteeCompanyId.setValidators(kind === 'company' ? Validators.required : null);
    granteeEmail.setValidators(kind === 'person' ? [Validators.required, Validators.email] : null);
    granteeCompanyId.updateValueAndValidity();
    granteeEmail.updateValueAndValidity();
  }

  private toRequest(): GrantRequest {
    const value = this.form.getRawValue();
    const expiresAt = new Date(value.expiresAt).toISOString();
    return value.granteeKind === 'company'
      ? { granteeCompanyId: value.granteeCompanyId, access: value.access, expiresAt }
      : { granteeEmail: value.granteeEmail.trim(), access: value.access, expiresAt };
  }
}

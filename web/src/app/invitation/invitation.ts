import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { Router, RouterLink } from '@angular/router';
import type { InvitationPreview } from '@cellwarden/shared';
import { switchMap } from 'rxjs';
import { Auth } from '../core/auth';
import { PasswordFields } from '../core/password-fields/password-fields';
import { passwordPair, passwordsMatch } from '../core/password-rules';
import { serverErrorOf, showServerError } from '../core/api-error';
import { LoadState, toLoadState } from '../core/load-state';
import { InvitationApi } from './invitation-api';
import { roleLabel } from '../core/role-label';

/** Accepting an invitation (route /invitation/:token): shows what it is for, then name and password. */
@Component({
  selector: 'cw-invitation',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    PasswordFields,
    ReactiveFormsModule,
    MatFormFieldModule,
    MatInputModule,
    MatButtonModule,
    MatProgressSpinnerModule,
    RouterLink,
    DatePipe,
  ],
  templateUrl: './invitation.html',
  styleUrl: '../password-reset/password-reset.scss',
})
export class Invitation {
  private readonly api = inject(InvitationApi);
  private readonly auth = inject(Auth);
  private readonly router = inject(Router);
  private readonly fb = inject(FormBuilder);

  /** The token from the invitation e-mail. */
  readonly token = input.required<string>();

  protected readonly roleLabel = roleLabel;
  protected readonly preview = toSignal(
    toObservable(this.token).pipe(
      switchMap((token) =>
        toLoadState(
          this.api.preview(token),
          'This invitation cannot be opened. It may have expired or been used.',
        ),
      ),
    ),
    { initialValue: { status: 'loading' } as LoadState<InvitationPreview> },
  );
  protected readonly form = this.fb.nonNullable.group(
    { displayName: ['', [Validators.required, Validators.maxLength(100)]], ...passwordPair(this.fb) },
    { validators: passwordsMatch },
  );
  protected readonly submitting = signal(false);
  protected readonly serverError = signal<string | null>(null);

  protected accept(): void {
    this.serverError.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { displayName, password } = this.form.getRawValue();
    this.submitting.set(true);
    this.auth.acceptInvitation({ token: this.token(), displayName: displayName.trim(), password }).subscribe({
      next: () => void this.router.navigate(['/systems']),
      error: (error: unknown) => {
        this.submitting.set(false);
        this.serverError.set(
          showServerError(this.form, serverErrorOf(error, 'Accepting failed. Try again.')),
        );
      },
    });
  }
}

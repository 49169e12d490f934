import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { RouterLink } from '@angular/router';
import { serverErrorOf, showServerError } from '../../core/api-error';
import { PasswordFields } from '../../core/password-fields/password-fields';
import { passwordPair, passwordsMatch } from '../../core/password-rules';
import { ResetApi } from '../reset-api';

/** Sets a new password with the token from the reset e-mail (route /password-reset/:token). */
@Component({
  selector: 'cw-new-password',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    PasswordFields,
    ReactiveFormsModule,
    MatFormFieldModule,
    MatInputModule,
    MatButtonModule,
    RouterLink,
  ],
  templateUrl: './new-password.html',
  styleUrl: '../password-reset.scss',
})
export class NewPassword {
  private readonly api = inject(ResetApi);
  private readonly fb = inject(FormBuilder);

  /** The token from the link. */
  readonly token = input.required<string>();

  protected readonly form = this.fb.nonNullable.group(passwordPair(this.fb), { validators: passwordsMatch });
  protected readonly done = signal(false);
  protected readonly submitting = signal(false);
  protected readonly serverError = signal<string | null>(null);

  protected setPassword(): void {
    this.serverError.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.submitting.set(true);
    const { password } = this.form.getRawValue();
    this.api.completeReset({ token: this.token(), password }).subscribe({
      next: () => {
        this.submitting.set(false);
        this.done.set(true);
      },
      error: (error: unknown) => {
        this.submitting.set(false);
        const fallback = 'The password could not be set. The link may have expired; ask for a new one.';
        this.serverError.set(showServerError(this.form, serverErrorOf(error, fallback)));
      },
    });
  }
}

import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormBuilder, FormGroupDirective, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { serverErrorOf, showServerError } from '../core/api-error';
import { Auth } from '../core/auth';
import { PasswordFields } from '../core/password-fields/password-fields';
import { passwordPair, passwordsMatch } from '../core/password-rules';
import { AccountApi } from './account-api';

/** The person's own account: who they are signed in as, and a new password that ends their other sign-ins. */
@Component({
  selector: 'cw-account',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [PasswordFields, ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatButtonModule],
  templateUrl: './account.html',
  styleUrl: './account.scss',
})
export class Account {
  private readonly api = inject(AccountApi);
  private readonly fb = inject(FormBuilder);
  protected readonly user = inject(Auth).currentUser;

  protected readonly form = this.fb.nonNullable.group(
    { currentPassword: this.fb.nonNullable.control('', Validators.required), ...passwordPair(this.fb) },
    { validators: passwordsMatch },
  );
  protected readonly submitting = signal(false);
  protected readonly done = signal(false);
  protected readonly serverError = signal<string | null>(null);

  protected changePassword(formDirective: FormGroupDirective): void {
    this.serverError.set(null);
    this.done.set(false);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.submitting.set(true);
    const { currentPassword, password } = this.form.getRawValue();
    this.api.changePassword(currentPassword, password).subscribe({
      next: () => {
        this.submitting.set(false);
        this.done.set(true);
        // Clears the fields and their touched state, so no "required" appears after a success.
        formDirective.resetForm();
      },
      error: (error: unknown) => {
        this.submitting.set(false);
        const problem = serverErrorOf(error, 'The password could not be changed. Try again.');
        // The server names the new password `newPassword`; this form calls it `password`.
        const field = problem.field === 'newPassword' ? 'password' : problem.field;
        this.serverError.set(showServerError(this.form, { ...problem, field }));
      },
    });
  }
}

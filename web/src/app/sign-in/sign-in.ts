import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { Router } from '@angular/router';
import { Auth } from '../core/auth';
import type { ApiErrorBody } from '../core/system-summary';

/** The sign-in screen. */
@Component({
  selector: 'cw-sign-in',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatButtonModule],
  templateUrl: './sign-in.html',
  styleUrl: './sign-in.scss',
})
export class SignIn {
  private readonly auth = inject(Auth);
  private readonly router = inject(Router);

  protected readonly form = inject(FormBuilder).nonNullable.group({
    email: ['', [Validators.required, Validators.email]],
    password: ['', Validators.required],
  });
  protected readonly serverError = signal<string | null>(null);
  protected readonly submitting = signal(false);

  protected signIn(): void {
    this.serverError.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { email, password } = this.form.getRawValue();
    this.submitting.set(true);
    this.auth.signIn(email, password).subscribe({
      next: () => {
        this.submitting.set(false);
        void this.router.navigate(['/systems']);
      },
      error: (error: unknown) => {
        this.submitting.set(false);
        this.serverError.set(messageOf(error));
      },
    });
  }
}

function messageOf(error: unknown): string {
  if (error instanceof HttpErrorResponse) {
    const body = error.error as Partial<ApiErrorBody> | null;
    if (body?.error?.message) return body.error.message;
    if (error.status === 0) return 'The server cannot be reached. Check the connection and try again.';
  }
  return 'Sign-in failed. Try again.';
}

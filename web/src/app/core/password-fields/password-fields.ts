import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { PASSWORD_MAX_BYTES, PASSWORD_MIN } from '../password-rules';

/**
 * The password and its repetition, as every form that sets one shows them (invitation, reset, account):
 * the group holds the `password` and `confirmation` controls of `passwordPair`, checked by `passwordsMatch`.
 */
@Component({
  selector: 'cw-password-fields',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule],
  template: `
    <ng-container [formGroup]="group()">
      <mat-form-field appearance="outline">
        <mat-label>{{ label() }}</mat-label>
        <input matInput type="password" formControlName="password" autocomplete="new-password" required />
        <mat-hint>At least {{ minLength }} characters.</mat-hint>
        @let password = group().controls['password'];
        @if (password.hasError('required')) {
          <mat-error>{{ label() }} is required.</mat-error>
        } @else if (password.hasError('minlength')) {
          <mat-error>{{ label() }} must be at least {{ minLength }} characters.</mat-error>
        } @else if (password.hasError('tooLong')) {
          <mat-error
            >{{ label() }} is too long: at most {{ maxBytes }} bytes (fewer letters with accents or
            symbols).</mat-error
          >
        } @else if (password.hasError('server')) {
          <mat-error>{{ password.getError('server') }}</mat-error>
        }
      </mat-form-field>
      <mat-form-field appearance="outline">
        <mat-label>{{ repeatLabel() }}</mat-label>
        <input matInput type="password" formControlName="confirmation" autocomplete="new-password" required />
        @let confirmation = group().controls['confirmation'];
        @if (confirmation.hasError('required')) {
          <mat-error>{{ repeatLabel() }} to confirm it.</mat-error>
        } @else if (confirmation.hasError('mismatch')) {
          <mat-error>The two passwords differ.</mat-error>
        }
      </mat-form-field>
    </ng-container>
  `,
  styles: `
    :host {
      display: contents;
    }
  `,
})
export class PasswordFields {
  /** The form group holding `password` and `confirmation`. */
  readonly group = input.required<FormGroup>();
  /** What the password is called here: "Password" for a new account, "New password" when it replaces one. */
  readonly label = input('Password');

  protected readonly repeatLabel = computed(() => `Repeat the ${this.label().toLowerCase()}`);
  protected readonly minLength = PASSWORD_MIN;
  protected readonly maxBytes = PASSWORD_MAX_BYTES;
}

import type { WritableSignal } from '@angular/core';
import { ReactiveFormsModule, type FormGroup } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { Observable } from 'rxjs';
import { apiProblem, showServerError } from '../core/api-error';

/** The widgets the register's two editors are built from (their styles are in register-form.scss). */
export const REGISTER_FORM_IMPORTS = [
  ReactiveFormsModule,
  MatFormFieldModule,
  MatInputModule,
  MatSelectModule,
  MatCheckboxModule,
  MatButtonModule,
];

/** What a register editor's template shows of a save: whether one is under way and the server's refusal. */
export interface SaveState {
  saving: WritableSignal<boolean>;
  problem: WritableSignal<string | null>;
}

/** How one editor sends its form and what it does with the answer. */
export interface FieldErrorSave<T> {
  /** Sends the form's values; called only once the form is valid. */
  request: () => Observable<T>;
  /** The control that shows a field the server names (`ratings.capacityAh`), or null when none does. */
  controlFor: (field: string) => string | null;
  /** Called with the stored record. */
  saved: (record: T) => void;
}

/**
 * Sends a register form once it is valid and no save is under way. When the server refuses, its words go
 * under the control of the field it names and, since that control may be folded away, above the buttons too.
 */
export function saveWithFieldErrors<T>(form: FormGroup, state: SaveState, save: FieldErrorSave<T>): void {
  form.markAllAsTouched();
  if (form.invalid || state.saving()) return;
  state.saving.set(true);
  state.problem.set(null);
  save.request().subscribe({
    next: (record) => {
      state.saving.set(false);
      save.saved(record);
    },
    error: (error: unknown) => {
      state.saving.set(false);
      const problem = apiProblem(error);
      const field = problem.field ? save.controlFor(problem.field) : null;
      showServerError(form, { message: problem.message, field });
      state.problem.set(problem.message);
    },
  });
}

/**
 * The words under a register field once it is touched and wrong: the server's, else the first rule it breaks.
 * `patternText` says what the field's pattern allows, for the fields that have one.
 */
export function fieldError(
  form: FormGroup,
  name: string,
  label: string,
  patternText?: string,
): string | null {
  const control = form.get(name);
  if (!control || !control.touched || control.valid) return null;
  if (control.hasError('server')) return control.getError('server');
  if (control.hasError('required')) return `${label} is required.`;
  if (control.hasError('min')) return `${label} must be at least ${control.getError('min').min}.`;
  if (control.hasError('max')) return `${label} must be at most ${control.getError('max').max}.`;
  if (control.hasError('pattern') && patternText) return `${label}: ${patternText}.`;
  if (control.hasError('maxlength')) return `${label} is too long.`;
  return `${label} is not valid.`;
}

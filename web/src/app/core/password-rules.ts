import { AbstractControl, FormBuilder, ValidationErrors, ValidatorFn, Validators } from '@angular/forms';
import { MAX_PASSWORD_BYTES, MIN_PASSWORD_LENGTH } from '@cellwarden/shared';

/** The shortest password any form accepts; the same constant the server checks. */
export const PASSWORD_MIN = MIN_PASSWORD_LENGTH;

/** The longest password in UTF-8 bytes: all the server's hash reads, so none of it is silently ignored. */
export const PASSWORD_MAX_BYTES = MAX_PASSWORD_BYTES;

/** Control validator: at most PASSWORD_MAX_BYTES bytes (letters with accents or symbols take 2–4 each). */
export const withinPasswordBytes: ValidatorFn = (control: AbstractControl): ValidationErrors | null =>
  new TextEncoder().encode(String(control.value ?? '')).length > PASSWORD_MAX_BYTES
    ? { tooLong: true }
    : null;

/** Group validator: `confirmation` must equal `password`; the error sits on the confirmation control. */
export const passwordsMatch: ValidatorFn = (group: AbstractControl): ValidationErrors | null => {
  const password = group.get('password');
  const confirmation = group.get('confirmation');
  if (!password || !confirmation) return null;
  const mismatch = confirmation.value !== '' && confirmation.value !== password.value;
  const others = { ...confirmation.errors };
  delete others['mismatch'];
  if (mismatch) confirmation.setErrors({ ...others, mismatch: true });
  else confirmation.setErrors(Object.keys(others).length ? others : null);
  return null;
};

/** A password + confirmation pair of controls, as both the invitation and the reset forms use it. */
export function passwordPair(fb: FormBuilder) {
  return {
    password: fb.nonNullable.control('', [
      Validators.required,
      Validators.minLength(PASSWORD_MIN),
      withinPasswordBytes,
    ]),
    confirmation: fb.nonNullable.control('', Validators.required),
  };
}

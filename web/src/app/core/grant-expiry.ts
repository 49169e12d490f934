import type { AbstractControl, ValidationErrors } from '@angular/forms';

const DAY_MS = 86_400_000;

/** The quick picks the grant form offers, in days from now. */
export const EXPIRY_QUICK_PICKS = [
  { days: 1, label: '1 day' },
  { days: 7, label: '7 days' },
  { days: 30, label: '30 days' },
] as const;

/** `now + days`, as the local "YYYY-MM-DDTHH:mm" value a datetime-local input shows. */
export function expiryInDays(days: number, now: number): string {
  return toLocalInputValue(new Date(now + days * DAY_MS));
}

/** A Date as a datetime-local input value, in the browser's time zone, to the minute. */
export function toLocalInputValue(date: Date): string {
  const pad = (n: number) => String(n).padStart(2, '0');
  return (
    `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())}` +
    `T${pad(date.getHours())}:${pad(date.getMinutes())}`
  );
}

/** Validator factory: the datetime-local value must parse and lie after `now()`. */
export function futureInstant(now: () => number) {
  return (control: AbstractControl<string>): ValidationErrors | null => {
    if (!control.value) return null;
    const at = new Date(control.value).getTime();
    if (Number.isNaN(at)) return { instant: true };
    return at > now() ? null : { past: true };
  };
}

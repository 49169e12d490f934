// Installer tools take numbers typed by a person; each refusal names the field so a form can mark it.
import { quoteValue } from '../telemetry/telemetry-input-error';

/** Why an installer input was refused; stable, safe to branch on. */
export type InstallerInputErrorCode =
  | 'installer-input-not-finite'
  | 'installer-input-not-positive'
  | 'installer-input-out-of-range'
  | 'installer-input-not-allowed';

/** A refused installer input: a stable `code` and the `field` (e.g. `loads[2].hoursPerDay`) at fault. */
export class InstallerInputError extends Error {
  /** Stable, machine-readable reason. */
  readonly code: InstallerInputErrorCode;
  /** Path of the offending input field. */
  readonly field: string;

  constructor(code: InstallerInputErrorCode, field: string, message: string) {
    super(message);
    this.name = 'InstallerInputError';
    this.code = code;
    this.field = field;
  }
}

/** Returns `value` when it is a finite number in [min, max] (min excluded when `exclusiveMin`); throws otherwise. */
export function requireNumberInRange(
  field: string,
  value: unknown,
  range: { min: number; max: number; exclusiveMin?: boolean; unit?: string },
): number {
  const unit = range.unit ? ` ${range.unit}` : '';
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new InstallerInputError(
      'installer-input-not-finite',
      field,
      `${field} must be a finite number; got ${quoteValue(value)}`,
    );
  }
  if (range.exclusiveMin && range.min === 0 && value <= 0) {
    throw new InstallerInputError(
      'installer-input-not-positive',
      field,
      `${field} must be greater than 0${unit}; got ${value}`,
    );
  }
  const belowMin = range.exclusiveMin ? value <= range.min : value < range.min;
  if (belowMin || value > range.max) {
    const lower = range.exclusiveMin ? `above ${range.min}` : `from ${range.min}`;
    throw new InstallerInputError(
      'installer-input-out-of-range',
      field,
      `${field} must be ${lower} up to ${range.max}${unit}; got ${value}`,
    );
  }
  return value;
}

/** Returns `value` when it is one of `allowed`; throws naming the field and the allowed values otherwise. */
export function requireOneOf<T>(field: string, value: unknown, allowed: readonly T[]): T {
  if (!allowed.includes(value as T)) {
    throw new InstallerInputError(
      'installer-input-not-allowed',
      field,
      `${field} must be one of ${allowed.join(', ')}; got ${quoteValue(value)}`,
    );
  }
  return value as T;
}

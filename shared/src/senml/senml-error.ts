// Errors for SenML input, whether it breaks RFC 8428 itself (`senml_*`), the transport (`payload_*`) or
// Cellwarden's reading profile on top of it (the rest).
import { quoteValue, TelemetryInputError } from '../telemetry/telemetry-input-error';

/** Why a SenML payload was refused. */
export type SenmlErrorCode =
  | 'payload_too_large'
  | 'payload_not_utf8'
  | 'payload_not_json'
  | 'senml_not_array'
  | 'senml_empty_pack'
  | 'senml_not_object'
  | 'senml_bad_type'
  | 'senml_not_finite'
  | 'senml_must_understand'
  | 'senml_unsupported_version'
  | 'senml_bad_name'
  | 'senml_no_value'
  | 'senml_multiple_values'
  | 'senml_bad_data_value'
  | 'foreign_name'
  | 'wrong_device'
  | 'mixed_devices'
  | 'unknown_measurement'
  | 'missing_unit'
  | 'wrong_unit'
  | 'wrong_value_type'
  | 'duplicate_measurement'
  | 'incomplete_reading';

/** Refused SenML input; `field` is the JSON path of the offending label, e.g. `[2].v`. */
export class SenmlError extends TelemetryInputError {
  declare readonly code: SenmlErrorCode;

  constructor(code: SenmlErrorCode, message: string, options: { field?: string; cause?: unknown } = {}) {
    super(code, message, options);
    this.name = 'SenmlError';
  }
}

/** A label holding the wrong JSON type, e.g. `[0].v must be a number; got "12.7"`. */
export function wrongTypeError(field: string, expected: string, value: unknown): SenmlError {
  return new SenmlError('senml_bad_type', `${field} must be ${expected}; got ${quoteValue(value)}`, {
    field,
  });
}

/** A resolved name outside the RFC 8428 §4.5.1 character set. */
export function badNameError(field: string, name: string): SenmlError {
  return new SenmlError(
    'senml_bad_name',
    `${field} must resolve to a name of A-Z a-z 0-9 - : . / _ starting with a letter or digit; got ${quoteValue(name)}`,
    { field },
  );
}

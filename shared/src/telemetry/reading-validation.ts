// Plausibility limits for a battery reading. They are wide on purpose: they catch unit mix-ups (mV sent as
// V), broken sensors and wrong clocks, not batteries that are merely unhealthy.
import { BatteryReading } from './reading';
import { quoteTime, quoteValue, TelemetryInputError } from './telemetry-input-error';

/** Plausible pack voltage, volts: a 48 V nominal bank tops out below 60 V while equalising; 70 V leaves room. */
export const VOLTAGE_RANGE_V = { min: 0, max: 70 } as const;
/** Plausible pack current, amperes (charging positive): beyond a 2000 A inverter surge is a sensor fault. */
export const CURRENT_RANGE_A = { min: -2000, max: 2000 } as const;
/** Plausible pack temperature, degrees Celsius. */
export const TEMPERATURE_RANGE_C = { min: -60, max: 100 } as const;
/** State of charge, percent. */
export const STATE_OF_CHARGE_RANGE_PERCENT = { min: 0, max: 100 } as const;
/** Plausible terminal power, watts: the voltage ceiling times the current limit. */
export const POWER_RANGE_W = { min: -140_000, max: 140_000 } as const;
/** How far a reading's time may lie ahead of the receiver's clock, milliseconds (device clocks drift). */
export const MAX_FUTURE_SKEW_MS = 5 * 60 * 1000;
/** How old a reading may be, milliseconds: a device offline for a winter still uploads its backlog. */
export const MAX_READING_AGE_MS = 400 * 24 * 60 * 60 * 1000;

/** Why a reading was refused. */
export type ReadingValidationErrorCode = 'not_finite' | 'out_of_range' | 'too_far_in_future' | 'too_old';

/** A reading whose values cannot be true; `field` names the reading property (`voltage`, `sourceCurrents.solar`). */
export class ReadingValidationError extends TelemetryInputError {
  declare readonly code: ReadingValidationErrorCode;

  constructor(
    code: ReadingValidationErrorCode,
    message: string,
    options: { field?: string; cause?: unknown } = {},
  ) {
    super(code, message, options);
    this.name = 'ReadingValidationError';
  }
}

interface Range {
  readonly min: number;
  readonly max: number;
}

/** Throws a ReadingValidationError unless every value of the reading is finite and plausible at `now` (ms). */
export function validateReading(reading: BatteryReading, options: { now: number }): void {
  checkMeasuredAt(reading.measuredAt, options.now);
  checkRange('voltage', reading.voltage, VOLTAGE_RANGE_V, 'V');
  checkRange('current', reading.current, CURRENT_RANGE_A, 'A');
  checkRange('temperature', reading.temperature, TEMPERATURE_RANGE_C, '°C');
  if (reading.stateOfCharge !== undefined) {
    checkRange('stateOfCharge', reading.stateOfCharge, STATE_OF_CHARGE_RANGE_PERCENT, '%');
  }
  if (reading.power !== undefined) checkRange('power', reading.power, POWER_RANGE_W, 'W');
  for (const [sourceId, current] of Object.entries(reading.sourceCurrents ?? {})) {
    checkRange(`sourceCurrents.${sourceId}`, current, CURRENT_RANGE_A, 'A');
  }
}

function checkFinite(field: string, value: unknown): asserts value is number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new ReadingValidationError(
      'not_finite',
      `${field} must be a finite number; got ${quoteValue(value)}`,
      {
        field,
      },
    );
  }
}

function checkRange(field: string, value: unknown, range: Range, unit: string): void {
  checkFinite(field, value);
  if (value < range.min || value > range.max) {
    throw new ReadingValidationError(
      'out_of_range',
      `${field} must be between ${range.min} and ${range.max} ${unit}; got ${value}`,
      { field },
    );
  }
}

function checkMeasuredAt(measuredAt: unknown, now: number): void {
  checkFinite('measuredAt', measuredAt);
  if (measuredAt > now + MAX_FUTURE_SKEW_MS) {
    throw new ReadingValidationError(
      'too_far_in_future',
      `measuredAt must be at most 5 minutes after ${quoteTime(now)}; got ${quoteTime(measuredAt)}`,
      { field: 'measuredAt' },
    );
  }
  if (measuredAt < now - MAX_READING_AGE_MS) {
    throw new ReadingValidationError(
      'too_old',
      `measuredAt must be at most 400 days before ${quoteTime(now)}; got ${quoteTime(measuredAt)}`,
      { field: 'measuredAt' },
    );
  }
}

import { BatteryReading } from './reading';
import {
  MAX_FUTURE_SKEW_MS,
  MAX_READING_AGE_MS,
  ReadingValidationError,
  validateReading,
} from './reading-validation';
import { TelemetryInputError } from './telemetry-input-error';

const now = Date.UTC(2026, 11, 2, 6, 0, 0);
const reading: BatteryReading = {
  measuredAt: now - 1000,
  voltage: 13.3,
  current: -4.2,
  temperature: 18.5,
  stateOfCharge: 87,
  power: -55.9,
  sourceCurrents: { solar: 6.1, dcdc: 0 },
};

function refusal(candidate: BatteryReading): ReadingValidationError {
  try {
    validateReading(candidate, { now });
  } catch (error) {
    expect(error).toBeInstanceOf(ReadingValidationError);
    expect(error).toBeInstanceOf(TelemetryInputError);
    return error as ReadingValidationError;
  }
  throw new Error('expected the reading to be refused');
}

describe('validateReading', () => {
  it('accepts a plausible 12 V reading', () => {
    expect(() => validateReading(reading, { now })).not.toThrow();
  });

  it('accepts a reading without the optional values', () => {
    const { measuredAt, voltage, current, temperature } = reading;
    expect(() => validateReading({ measuredAt, voltage, current, temperature }, { now })).not.toThrow();
  });

  it('refuses a voltage sent in the wrong scale, quoting it', () => {
    const error = refusal({ ...reading, voltage: 612 });
    expect(error.code).toBe('out_of_range');
    expect(error.field).toBe('voltage');
    expect(error.message).toBe('voltage must be between 0 and 70 V; got 612');
  });

  it.each([
    ['current', { current: -2000.5 }, 'current must be between -2000 and 2000 A; got -2000.5'],
    ['temperature', { temperature: 150 }, 'temperature must be between -60 and 100 °C; got 150'],
    ['stateOfCharge', { stateOfCharge: 101 }, 'stateOfCharge must be between 0 and 100 %; got 101'],
    ['power', { power: 200_000 }, 'power must be between -140000 and 140000 W; got 200000'],
    ['sourceCurrents.solar', { sourceCurrents: { solar: 5000 } }, 'between -2000 and 2000 A; got 5000'],
  ])('refuses an implausible %s', (field, change, message) => {
    const error = refusal({ ...reading, ...change });
    expect(error.code).toBe('out_of_range');
    expect(error.field).toBe(field);
    expect(error.message).toContain(message);
  });

  it('accepts the range limits themselves', () => {
    const edges = { voltage: 70, current: -2000, temperature: -60, stateOfCharge: 0 };
    expect(() => validateReading({ ...reading, ...edges }, { now })).not.toThrow();
  });

  it.each([Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY])(
    'refuses a voltage of %p',
    (voltage) => {
      const error = refusal({ ...reading, voltage });
      expect(error.code).toBe('not_finite');
      expect(error.message).toBe(`voltage must be a finite number; got ${voltage}`);
    },
  );

  it('refuses a value that is not a number at all', () => {
    const error = refusal({ ...reading, temperature: '18' as unknown as number });
    expect(error.code).toBe('not_finite');
    expect(error.message).toBe('temperature must be a finite number; got "18"');
  });

  it('allows five minutes of clock drift into the future, not more', () => {
    expect(() =>
      validateReading({ ...reading, measuredAt: now + MAX_FUTURE_SKEW_MS }, { now }),
    ).not.toThrow();
    const error = refusal({ ...reading, measuredAt: now + MAX_FUTURE_SKEW_MS + 1 });
    expect(error.code).toBe('too_far_in_future');
    expect(error.field).toBe('measuredAt');
    expect(error.message).toContain('2026-12-02T06:05:00.001Z');
  });

  it('accepts a backlog up to 400 days old, not older', () => {
    expect(() =>
      validateReading({ ...reading, measuredAt: now - MAX_READING_AGE_MS }, { now }),
    ).not.toThrow();
    const error = refusal({ ...reading, measuredAt: now - MAX_READING_AGE_MS - 1 });
    expect(error.code).toBe('too_old');
    expect(error.field).toBe('measuredAt');
  });

  it('refuses a time no Date can hold without failing itself', () => {
    const error = refusal({ ...reading, measuredAt: 1e300 });
    expect(error.code).toBe('too_far_in_future');
    expect(error.message).toContain('1e+300 ms');
  });
});

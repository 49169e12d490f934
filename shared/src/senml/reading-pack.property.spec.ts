// Property-based checks of the reading decoder: it faces whatever a device or an attacker publishes.
import fc from 'fast-check';
import { BatteryReading } from '../telemetry/reading';
import { MAX_FUTURE_SKEW_MS, MAX_READING_AGE_MS, validateReading } from '../telemetry/reading-validation';
import { TelemetryInputError } from '../telemetry/telemetry-input-error';
import { encodeReadingPack, parseReadingPayload } from './reading-pack';

const now = Date.UTC(2026, 11, 2, 6, 0, 0);

/** Runs the parser and says how it ended: valid readings, a TelemetryInputError, or anything else (a bug). */
function outcome(payload: Uint8Array | string): 'readings' | 'refused' {
  try {
    const { deviceId, readings } = parseReadingPayload(payload, { now });
    expect(typeof deviceId).toBe('string');
    expect(readings.length).toBeGreaterThan(0);
    for (const reading of readings) validateReading(reading, { now });
    return 'readings';
  } catch (error) {
    if (error instanceof TelemetryInputError) return 'refused';
    throw error;
  }
}

// Near-valid records, so the search reaches the profile checks and not only the type checks.
const looseRecord = fc.record(
  {
    bn: fc.constantFrom('urn:dev:cw:van-1:', 'urn:dev:cw:van-2:', 'urn:dev:ow:x:', '', 'urn:dev:cw:'),
    bt: fc.constantFrom(now / 1000, 0, 1e9, -1e300),
    bu: fc.constantFrom('V', 'A'),
    bver: fc.constantFrom(5, 10, 11),
    n: fc.constantFrom(
      'voltage',
      'current',
      'temperature',
      'soc',
      'power',
      'source:solar',
      'van-1:voltage',
      'x y',
    ),
    u: fc.constantFrom('V', 'A', 'Cel', '%EL', 'W', '%RH'),
    v: fc.oneof(fc.double(), fc.integer({ min: -3000, max: 3000 })),
    vs: fc.string(),
    s: fc.double(),
    t: fc.oneof(fc.integer({ min: -600, max: 600 }), fc.double()),
    x_: fc.constant(1),
  },
  { requiredKeys: [] },
);

const finite = (min: number, max: number) => fc.double({ min, max, noNaN: true }).map((value) => value + 0); // + 0 turns -0 into 0, as JSON does
const packId = fc.stringMatching(/^[A-Za-z0-9][A-Za-z0-9._-]{0,15}$/);
const readingArbitrary: fc.Arbitrary<BatteryReading> = fc.record({
  measuredAt: fc.integer({ min: now - MAX_READING_AGE_MS, max: now + MAX_FUTURE_SKEW_MS }),
  voltage: finite(0, 70),
  current: finite(-2000, 2000),
  temperature: finite(-60, 100),
  stateOfCharge: fc.option(finite(0, 100), { nil: undefined }),
  power: fc.option(finite(-140_000, 140_000), { nil: undefined }),
  sourceCurrents: fc.option(fc.dictionary(packId, finite(-2000, 2000), { minKeys: 1, maxKeys: 4 }), {
    nil: undefined,
  }),
});

describe('parseReadingPayload properties', () => {
  it('returns valid readings or throws a TelemetryInputError for any JSON value', () => {
    fc.assert(
      fc.property(fc.jsonValue(), (value) => void outcome(JSON.stringify(value) ?? '')),
      {
        numRuns: 500,
      },
    );
  });

  it('returns valid readings or throws a TelemetryInputError for arbitrary bytes', () => {
    fc.assert(
      fc.property(fc.uint8Array({ maxLength: 200 }), (bytes) => void outcome(bytes)),
      { numRuns: 300 },
    );
  });

  it('returns valid readings or throws a TelemetryInputError for near-valid packs', () => {
    const seen = new Set<string>();
    fc.assert(
      fc.property(fc.array(looseRecord, { maxLength: 12 }), (pack) => {
        seen.add(outcome(JSON.stringify(pack)));
      }),
      { numRuns: 2000 },
    );
    expect(seen).toContain('refused');
  });

  it('round-trips any valid readings of one device through encode, JSON and parse', () => {
    fc.assert(
      fc.property(
        packId,
        fc.uniqueArray(readingArbitrary, {
          selector: (reading) => reading.measuredAt,
          minLength: 1,
          maxLength: 8,
        }),
        (deviceId, readings) => {
          const payload = new TextEncoder().encode(JSON.stringify(encodeReadingPack(deviceId, readings)));
          const expected = [...readings].sort((a, b) => a.measuredAt - b.measuredAt);
          expect(parseReadingPayload(payload, { now, expectedDeviceId: deviceId })).toEqual({
            deviceId,
            readings: expected,
          });
        },
      ),
      { numRuns: 300 },
    );
  });
});

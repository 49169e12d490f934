// The one-pass reading of the common pack must answer exactly as the general path does, or step aside.
import fc from 'fast-check';
import { BatteryReading } from '../telemetry/reading';
import { MAX_FUTURE_SKEW_MS, MAX_READING_AGE_MS } from '../telemetry/reading-validation';
import { TelemetryInputError } from '../telemetry/telemetry-input-error';
import { decodeCommonPack } from './common-pack';
import { decodeReadingPackFully, encodeReadingPack } from './reading-pack';

const now = Date.UTC(2026, 11, 3, 21, 0, 0);
const options = { now, expectedDeviceId: 'van-1' };

/** The general path's answer: the readings, or the refusal's code and field. */
function general(pack: unknown, opts: { now: number; expectedDeviceId?: string } = options) {
  try {
    return { decoded: decodeReadingPackFully(pack, opts) };
  } catch (error) {
    if (!(error instanceof TelemetryInputError)) throw error;
    return { refused: error.code };
  }
}

/** Both paths agree: the common one returns exactly what the general one does, or nothing when it refuses. */
function expectAgreement(pack: unknown, opts: { now: number; expectedDeviceId?: string } = options) {
  const common = decodeCommonPack(structuredClone(pack), opts);
  const answer = general(structuredClone(pack), opts);
  if (common !== undefined) expect(answer).toEqual({ decoded: common });
  if ('refused' in answer) expect(common).toBeUndefined();
  return common;
}

const finite = (min: number, max: number) => fc.double({ min, max, noNaN: true }).map((value) => value + 0);
const sourceId = fc.constantFrom('solar', 'dcdc', 'shore', 'alt.2', 'constructor', '1');
const readingArbitrary: fc.Arbitrary<BatteryReading> = fc.record({
  measuredAt: fc.integer({ min: now - MAX_READING_AGE_MS - 1000, max: now + MAX_FUTURE_SKEW_MS + 1000 }),
  voltage: fc.oneof(finite(0, 70), fc.constantFrom(-1, 71)),
  current: finite(-2000, 2000),
  temperature: finite(-60, 100),
  stateOfCharge: fc.option(finite(0, 100), { nil: undefined }),
  power: fc.option(finite(-140_000, 140_000), { nil: undefined }),
  sourceCurrents: fc.option(fc.dictionary(sourceId, finite(-2000, 2000), { minKeys: 1, maxKeys: 3 }), {
    nil: undefined,
  }),
});
const readingsArbitrary = fc
  .array(readingArbitrary, { minLength: 1, maxLength: 6 })
  .map((readings) => readings.sort((a, b) => a.measuredAt - b.measuredAt));

// Changes a device or an attacker might make to a well-formed pack.
const labels = [
  'bn',
  'bt',
  'bu',
  'bv',
  'bs',
  'bver',
  'n',
  'u',
  'v',
  'vs',
  'vb',
  'vd',
  's',
  't',
  'ut',
  'x',
  'x_',
];
const labelValues = fc.constantFrom<unknown>(
  0,
  -0,
  1,
  -5,
  1.5,
  2 ** 28,
  now / 1000,
  1e308,
  10,
  11,
  'V',
  'A',
  'Cel',
  'voltage',
  'current',
  'soc',
  'source:solar',
  'source:so lar',
  'urn:dev:cw:van-1:',
  'urn:dev:cw:van-2:',
  'urn:dev:cw:van-1',
  '',
  true,
  null,
  [],
  {},
);
const mutation = fc.oneof(
  fc.record({
    kind: fc.constant('set' as const),
    at: fc.nat(),
    label: fc.constantFrom(...labels),
    value: labelValues,
  }),
  fc.record({ kind: fc.constant('drop' as const), at: fc.nat(), label: fc.constantFrom(...labels) }),
  fc.record({ kind: fc.constant('swap' as const), at: fc.nat(), other: fc.nat() }),
  fc.record({ kind: fc.constant('copy' as const), at: fc.nat() }),
  fc.record({ kind: fc.constant('remove' as const), at: fc.nat() }),
  fc.record({ kind: fc.constant('replace' as const), at: fc.nat(), value: labelValues }),
);
type Mutation = typeof mutation extends fc.Arbitrary<infer M> ? M : never;

function mutate(pack: readonly object[], changes: Mutation[]): unknown[] {
  const records: unknown[] = pack.map((record) => ({ ...record }));
  for (const change of changes) {
    if (records.length === 0) break;
    const at = change.at % records.length;
    const record = records[at] as Record<string, unknown>;
    if (change.kind === 'set' && typeof record === 'object' && record !== null)
      record[change.label] = change.value;
    if (change.kind === 'drop' && typeof record === 'object' && record !== null) delete record[change.label];
    if (change.kind === 'swap') {
      const other = change.other % records.length;
      [records[at], records[other]] = [records[other], records[at]];
    }
    if (change.kind === 'copy') records.splice(at, 0, structuredClone(record));
    if (change.kind === 'remove') records.splice(at, 1);
    if (change.kind === 'replace') records[at] = change.value;
  }
  return records;
}

describe('decodeCommonPack', () => {
  it('reads every pack the encoder writes, exactly as the general path does (or steps aside for a refusal)', () => {
    fc.assert(
      fc.property(readingsArbitrary, (readings) => {
        const pack = encodeReadingPack('van-1', readings);
        const common = expectAgreement(pack);
        // Only an implausible value or a clash of two readings in one millisecond sends it the general way.
        if (!('refused' in general(pack))) expect(common).toBeDefined();
      }),
      { numRuns: 400 },
    );
  });

  it('agrees with the general path on changed, broken and unusual packs', () => {
    fc.assert(
      fc.property(
        readingsArbitrary,
        fc.array(mutation, { minLength: 1, maxLength: 4 }),
        (readings, changes) => {
          expectAgreement(mutate(encodeReadingPack('van-1', readings), changes));
        },
      ),
      { numRuns: 3000 },
    );
  });

  it('agrees on any JSON value', () => {
    fc.assert(
      fc.property(fc.jsonValue(), (value) => void expectAgreement(value)),
      { numRuns: 500 },
    );
  });

  it('reads relative times against the receiver clock and base values and units from the first record', () => {
    const pack = [
      { bn: 'urn:dev:cw:van-1:', bt: -10, bu: 'A', bv: 0.5, n: 'current', v: 2 },
      { n: 'voltage', u: 'V', v: 12.8 },
      { n: 'temperature', u: 'Cel', v: 20.5 },
      { n: 'source:solar', v: 1, t: 5 },
      { n: 'voltage', u: 'V', v: 12.9, t: 5 },
      { n: 'current', v: 3, t: 5 },
      { n: 'temperature', u: 'Cel', v: 21, t: 5 },
    ];
    expect(expectAgreement(pack)).toEqual({
      deviceId: 'van-1',
      readings: [
        { measuredAt: now - 10_000, voltage: 13.3, current: 2.5, temperature: 21 },
        {
          measuredAt: now - 5000,
          voltage: 13.4,
          current: 3.5,
          temperature: 21.5,
          sourceCurrents: { solar: 1.5 },
        },
      ],
    });
  });

  it('steps aside for valid but rarer shapes, which the general path reads', () => {
    const base = { bn: 'urn:dev:cw:van-1:', bt: now / 1000 };
    const rarer = [
      // Records out of time order.
      [
        { ...base, n: 'voltage', u: 'V', v: 13, t: 1 },
        { n: 'current', u: 'A', v: 1, t: 1 },
        { n: 'temperature', u: 'Cel', v: 9, t: 1 },
        { n: 'voltage', u: 'V', v: 13, t: 0 },
        { n: 'current', u: 'A', v: 1, t: 0 },
        { n: 'temperature', u: 'Cel', v: 9, t: 0 },
      ],
      // A base field again in a later record.
      [
        { ...base, n: 'voltage', u: 'V', v: 13 },
        { bt: now / 1000, n: 'current', u: 'A', v: 1 },
        { n: 'temperature', u: 'Cel', v: 9 },
      ],
      // Full names without a base name.
      [
        { n: 'urn:dev:cw:van-1:voltage', u: 'V', v: 13, t: now / 1000 },
        { n: 'urn:dev:cw:van-1:current', u: 'A', v: 1, t: now / 1000 },
        { n: 'urn:dev:cw:van-1:temperature', u: 'Cel', v: 9, t: now / 1000 },
      ],
    ];
    for (const pack of rarer) {
      expect(decodeCommonPack(pack, options)).toBeUndefined();
      expect(general(pack)).toEqual({ decoded: expect.objectContaining({ deviceId: 'van-1' }) });
    }
  });

  it('steps aside for a pack from another device than the connection speaks for', () => {
    const pack = encodeReadingPack('van-2', [{ measuredAt: now, voltage: 13, current: 1, temperature: 9 }]);
    expect(decodeCommonPack(pack, options)).toBeUndefined();
    expect(general(pack)).toEqual({ refused: 'wrong_device' });
    expect(expectAgreement(pack, { now })).toEqual(expect.objectContaining({ deviceId: 'van-2' }));
  });
});

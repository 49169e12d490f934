import { resolvePack } from './resolve-pack';
import { SenmlError } from './senml-error';

// The receiver's clock, seconds since the epoch (2026-12-02T06:00:00Z).
const now = 1_796_191_200;

// RFC 8428 §5.1.3: six current samples a second apart after one voltage, with base time, unit and version.
const multipleMeasurements = [
  {
    bn: 'urn:dev:ow:10e2073a0108006:',
    bt: 1.276020076001e9,
    bu: 'A',
    bver: 5,
    n: 'voltage',
    u: 'V',
    v: 120.1,
  },
  { n: 'current', t: -5, v: 1.2 },
  { n: 'current', t: -4, v: 1.3 },
  { n: 'current', t: -3, v: 1.4 },
  { n: 'current', t: -2, v: 1.5 },
  { n: 'current', t: -1, v: 1.6 },
  { n: 'current', v: 1.7 },
];

function refusal(pack: unknown): SenmlError {
  try {
    resolvePack(pack, { now });
  } catch (error) {
    expect(error).toBeInstanceOf(SenmlError);
    return error as SenmlError;
  }
  throw new Error('expected the pack to be refused');
}

describe('resolvePack', () => {
  it('resolves a single datapoint without a time to now', () => {
    // RFC 8428 §5.1.1: one temperature, no base fields; a missing time means "now" (§4.5.3)
    const pack = [{ n: 'urn:dev:ow:10e2073a01080063', u: 'Cel', v: 23.1 }];
    expect(resolvePack(pack, { now })).toEqual([
      { n: 'urn:dev:ow:10e2073a01080063', u: 'Cel', v: 23.1, t: now },
    ]);
  });

  it('joins the base name to each name', () => {
    // RFC 8428 §5.1.2: voltage and current of one device under a shared base name
    const pack = [
      { bn: 'urn:dev:ow:10e2073a01080063:', n: 'voltage', u: 'V', v: 120.1 },
      { n: 'current', u: 'A', v: 1.2 },
    ];
    expect(resolvePack(pack, { now })).toEqual([
      { n: 'urn:dev:ow:10e2073a01080063:voltage', u: 'V', v: 120.1, t: now },
      { n: 'urn:dev:ow:10e2073a01080063:current', u: 'A', v: 1.2, t: now },
    ]);
  });

  it('resolves the multiple-measurements example to the RFC resolved form', () => {
    // RFC 8428 §5.1.2 pack resolved per §4.6 — full names, base unit applied, absolute times, and records in
    // chronological order (the voltage, sent first, was measured with the last current sample)
    const expected = [
      { n: 'urn:dev:ow:10e2073a0108006:current', u: 'A', v: 1.2, t: 1.276020071001e9 },
      { n: 'urn:dev:ow:10e2073a0108006:current', u: 'A', v: 1.3, t: 1.276020072001e9 },
      { n: 'urn:dev:ow:10e2073a0108006:current', u: 'A', v: 1.4, t: 1.276020073001e9 },
      { n: 'urn:dev:ow:10e2073a0108006:current', u: 'A', v: 1.5, t: 1.276020074001e9 },
      { n: 'urn:dev:ow:10e2073a0108006:current', u: 'A', v: 1.6, t: 1.276020075001e9 },
      { n: 'urn:dev:ow:10e2073a0108006:voltage', u: 'V', v: 120.1, t: 1.276020076001e9 },
      { n: 'urn:dev:ow:10e2073a0108006:current', u: 'A', v: 1.7, t: 1.276020076001e9 },
    ];
    const resolved = resolvePack(multipleMeasurements, { now });
    expect(resolved).toHaveLength(expected.length);
    resolved.forEach((record, index) => {
      const { t, ...rest } = expected[index];
      expect(record).toMatchObject(rest);
      expect(record.t).toBeCloseTo(t, 6);
    });
  });

  it('keeps a non-default version in every resolved record', () => {
    // RFC 8428 §4.6: bver stays in resolved records unless the version is 10
    const resolved = resolvePack(multipleMeasurements, { now });
    expect(resolved.every((record) => record.bver === 5)).toBe(true);
    expect(resolvePack([{ n: 'x', v: 1, bver: 10 }], { now })[0]).not.toHaveProperty('bver');
  });

  it('resolves string, boolean and data values', () => {
    // RFC 8428 §5.1.5: one record per data type under one base name
    const pack = [
      { bn: 'urn:dev:ow:10e2073a01080063:', n: 'temperature', u: 'Cel', v: 23.1 },
      { n: 'label', vs: 'Machine Room' },
      { n: 'open', vb: false },
      { n: 'nfc-reader', vd: 'aGkgCg' },
    ];
    expect(resolvePack(pack, { now }).slice(1)).toEqual([
      { n: 'urn:dev:ow:10e2073a01080063:label', vs: 'Machine Room', t: now },
      { n: 'urn:dev:ow:10e2073a01080063:open', vb: false, t: now },
      { n: 'urn:dev:ow:10e2073a01080063:nfc-reader', vd: 'aGkgCg', t: now },
    ]);
  });

  it('adds the base value to values and the base sum to sums', () => {
    // RFC 8428 §4.1: bv is added to v, bs to s
    const pack = [
      { bn: 'meter:', bv: 12, bs: 1000, n: 'v', v: 0.8 },
      { n: 'e', s: 5 },
    ];
    const [first, second] = resolvePack(pack, { now });
    expect(first.v).toBeCloseTo(12.8, 12);
    expect(second.s).toBe(1005);
  });

  it('treats small times as relative to now and large ones as absolute', () => {
    // RFC 8428 §4.5.3: values below 2^28 are relative to the current time
    const pack = [
      { n: 'a', v: 1, t: -60 },
      { n: 'b', v: 1, t: 2 ** 28 - 1 },
      { n: 'c', v: 1, t: 2 ** 28 },
    ];
    // (§4.6 then orders them by time: the absolute 2^28 s of 1978 comes first)
    expect(resolvePack(pack, { now }).map((record) => [record.n, record.t])).toEqual([
      ['c', 2 ** 28],
      ['a', now - 60],
      ['b', now + 2 ** 28 - 1],
    ]);
  });

  it('lets a later base field replace an earlier one', () => {
    // RFC 8428 §4.1: a base field holds until a record carries the same base field again
    const pack = [
      { bn: 'a:', bu: 'V', n: 'x', v: 1 },
      { n: 'y', v: 2 },
      { bn: 'b:', n: 'x', v: 3 },
    ];
    expect(resolvePack(pack, { now }).map((record) => [record.n, record.u])).toEqual([
      ['a:x', 'V'],
      ['a:y', 'V'],
      ['b:x', 'V'],
    ]);
  });

  it('refuses a resolved name outside the character set, blaming n', () => {
    // RFC 8428 §4.5.1: name characters and first character
    const error = refusal([{ bn: 'urn:dev:cw:van-1:', n: 'volt age', v: 1 }]);
    expect(error.code).toBe('senml_bad_name');
    expect(error.field).toBe('[0].n');
    expect(error.message).toContain('"urn:dev:cw:van-1:volt age"');
  });

  it('refuses a record with neither base name nor name', () => {
    const error = refusal([{ n: 'x', v: 1 }, { v: 2 }]);
    expect(error.code).toBe('senml_bad_name');
    expect(error.field).toBe('[1].bn');
  });

  it('refuses a base value that overflows to infinity', () => {
    const error = refusal([{ n: 'x', bv: 1.7e308, v: 1.7e308 }]);
    expect(error.code).toBe('senml_not_finite');
    expect(error.field).toBe('[0].v');
  });

  it('gives a record the base sum as its sum when it has no sum of its own', () => {
    // RFC 8428 §4.5.4: if only one of the Base Sum or Sum is present, the missing one is taken as zero
    // (check-pack accepts a record whose only sum is its own base sum, RFC 8428 §4.2)
    const pack = [
      { bn: 'meter:', bs: 1000, n: 'energy', u: 'J' },
      { n: 'energy', u: 'J', s: 5, t: 1 },
      { bn: 'other:', n: 'power', u: 'W', v: 3, t: 2 },
    ];
    const [first, second, third] = resolvePack(pack, { now });
    expect(first).toEqual({ n: 'meter:energy', u: 'J', s: 1000, t: now });
    expect(second.s).toBe(1005);
    // The base sum still applies (§4.1): base fields hold until a later record sets them again
    expect(third.s).toBe(1000);
    // Neither present: no sum at all
    expect(resolvePack([{ n: 'x', v: 1 }], { now })[0]).not.toHaveProperty('s');
  });

  it('puts the resolved records in chronological order, keeping the order within one instant', () => {
    // RFC 8428 §4.6: resolved records are sorted in chronological order
    const pack = [
      { bn: 'dev:', bt: 1.8e9, n: 'b', v: 2, t: 10 },
      { n: 'a', v: 1, t: 0 },
      { n: 'c', v: 3, t: 10 },
      { n: 'd', v: 4, t: 5 },
    ];
    expect(resolvePack(pack, { now }).map((r) => [r.n, r.t - 1.8e9])).toEqual([
      ['dev:a', 0],
      ['dev:d', 5],
      ['dev:b', 10],
      ['dev:c', 10],
    ]);
  });
});

import { BatteryReading } from '../telemetry/reading';
import { ReadingValidationError } from '../telemetry/reading-validation';
import { TelemetryInputError } from '../telemetry/telemetry-input-error';
import { decodeReadingPack, encodeReadingPack, parseReadingPayload } from './reading-pack';
import { SenmlError } from './senml-error';

const now = Date.UTC(2026, 11, 2, 6, 0, 0);
const first: BatteryReading = {
  measuredAt: now - 1500,
  voltage: 13.28,
  current: 6.4,
  temperature: 21.5,
  stateOfCharge: 82,
  power: 85,
  sourceCurrents: { solar: 4.1, dcdc: 2.3 },
};
const second: BatteryReading = { measuredAt: now - 500, voltage: 13.3, current: 6.1, temperature: 21.6 };
const bn = 'urn:dev:cw:van-1:';

function refusal(pack: unknown, options: { expectedDeviceId?: string } = {}): TelemetryInputError {
  try {
    decodeReadingPack(pack, { now, ...options });
  } catch (error) {
    expect(error).toBeInstanceOf(TelemetryInputError);
    return error as TelemetryInputError;
  }
  throw new Error('expected the pack to be refused');
}

function payloadRefusal(payload: Uint8Array | string): TelemetryInputError {
  try {
    parseReadingPayload(payload, { now });
  } catch (error) {
    expect(error).toBeInstanceOf(SenmlError);
    return error as TelemetryInputError;
  }
  throw new Error('expected the payload to be refused');
}

const minimal = (extra: object[] = []): object[] => [
  { bn, bt: now / 1000, n: 'voltage', u: 'V', v: 12.9 },
  { n: 'current', u: 'A', v: -3 },
  { n: 'temperature', u: 'Cel', v: 15 },
  ...extra,
];

describe('encodeReadingPack', () => {
  it('puts base name and base time on the first record and offsets later readings', () => {
    expect(encodeReadingPack('van-1', [first, second])).toEqual([
      { bn, bt: (now - 1500) / 1000, n: 'voltage', u: 'V', v: 13.28 },
      { n: 'current', u: 'A', v: 6.4 },
      { n: 'temperature', u: 'Cel', v: 21.5 },
      { n: 'soc', u: '%EL', v: 82 },
      { n: 'power', u: 'W', v: 85 },
      { n: 'source:solar', u: 'A', v: 4.1 },
      { n: 'source:dcdc', u: 'A', v: 2.3 },
      { n: 'voltage', u: 'V', v: 13.3, t: 1 },
      { n: 'current', u: 'A', v: 6.1, t: 1 },
      { n: 'temperature', u: 'Cel', v: 21.6, t: 1 },
    ]);
  });

  it('refuses ids that cannot be part of a SenML name', () => {
    expect(() => encodeReadingPack('van 1', [first])).toThrow(SenmlError);
    expect(() => encodeReadingPack('van-1', [{ ...second, sourceCurrents: { 'a:b': 1 } }])).toThrow(
      'sourceCurrents.a:b must be letters',
    );
    expect(() => encodeReadingPack('van-1', [])).toThrow('needs at least one reading');
  });
});

describe('decodeReadingPack', () => {
  it('decodes what it encodes, sorted by measured time', () => {
    const pack = JSON.parse(JSON.stringify(encodeReadingPack('van-1', [second, first])));
    expect(decodeReadingPack(pack, { now, expectedDeviceId: 'van-1' })).toEqual({
      deviceId: 'van-1',
      readings: [first, second],
    });
  });

  it('groups records by time however the base fields are laid out', () => {
    // RFC 8428 §4.1: base name and base time may be split and reset anywhere in the pack
    const pack = [
      { bn: 'urn:dev:cw:', bt: now / 1000, n: 'van-1:voltage', u: 'V', v: 12.9 },
      { bn, n: 'current', u: 'A', v: -3 },
      { n: 'voltage', u: 'V', v: 12.8, t: 60 },
      { n: 'temperature', u: 'Cel', v: 15 },
      { bt: now / 1000 + 60, n: 'current', u: 'A', v: -2 },
      { n: 'temperature', u: 'Cel', v: 15.1 },
    ];
    const { readings } = decodeReadingPack(pack, { now: now + 60_000 });
    expect(readings).toEqual([
      { measuredAt: now, voltage: 12.9, current: -3, temperature: 15 },
      { measuredAt: now + 60_000, voltage: 12.8, current: -2, temperature: 15.1 },
    ]);
  });

  it('takes a reading without a time as measured now', () => {
    // RFC 8428 §4.5.3: a time of 0 means roughly now
    const pack = minimal().map((record) => ({ ...record, bt: undefined }));
    expect(decodeReadingPack(JSON.parse(JSON.stringify(pack)), { now }).readings[0].measuredAt).toBe(now);
  });

  it('refuses a voltage in amperes', () => {
    const pack = minimal();
    pack[0] = { ...pack[0], u: 'A' };
    const error = refusal(pack);
    expect(error.code).toBe('wrong_unit');
    expect(error.field).toBe('[0].u');
    expect(error.message).toBe('[0].u must be "V" for voltage; got "A"');
  });

  it('refuses a measurement without a unit, even with a base unit elsewhere', () => {
    const error = refusal(minimal([{ n: 'soc', v: 50 }]));
    expect(error.code).toBe('missing_unit');
    expect(error.field).toBe('[3].u');
  });

  it('points a validation failure at the record that carried the value', () => {
    const error = refusal(minimal([{ n: 'soc', u: '%EL', v: 140 }]));
    expect(error).toBeInstanceOf(ReadingValidationError);
    expect(error.code).toBe('out_of_range');
    expect(error.field).toBe('[3].v');
    expect(error.message).toBe('stateOfCharge must be between 0 and 100 %; got 140');
  });

  it('refuses readings from a wrong clock', () => {
    const pack = minimal().map((record, index) =>
      index === 0 ? { ...record, bt: now / 1000 + 3600 } : record,
    );
    const error = refusal(pack);
    expect(error.code).toBe('too_far_in_future');
    expect(error.field).toBe('[0].t');
  });

  it.each([
    ['incomplete_reading', [{ bn, n: 'voltage', u: 'V', v: 12.9 }], '[0]'],
    ['unknown_measurement', minimal([{ n: 'humidity', u: '%RH', v: 40 }]), '[3].n'],
    ['duplicate_measurement', minimal([{ n: 'current', u: 'A', v: -3.1 }]), '[3].n'],
    ['wrong_value_type', minimal([{ n: 'power', u: 'W', vs: 'lots' }]), '[3]'],
    ['mixed_devices', minimal([{ bn: 'urn:dev:cw:van-2:', n: 'power', u: 'W', v: 1 }]), '[3].n'],
    ['foreign_name', [{ bn: 'urn:dev:ow:10e2073a01080063:', n: 'voltage', u: 'V', v: 1 }], '[0].n'],
    ['senml_empty_pack', [], undefined],
    ['senml_bad_name', minimal([{ n: 'source:so lar', u: 'A', v: 1 }]), '[3].n'],
  ])('refuses with %s', (code, pack, field) => {
    const error = refusal(pack);
    expect(error.code).toBe(code);
    expect(error.field).toBe(field);
  });

  it('refuses a pack that names another device than the one that sent it', () => {
    const error = refusal(minimal(), { expectedDeviceId: 'van-2' });
    expect(error.code).toBe('wrong_device');
    expect(error.message).toBe('[0] names device "van-1" but was sent by "van-2"');
  });
});

describe('parseReadingPayload', () => {
  it('parses UTF-8 bytes and strings alike', () => {
    const text = JSON.stringify(encodeReadingPack('van-1', [first]));
    const expected = { deviceId: 'van-1', readings: [first] };
    expect(parseReadingPayload(new TextEncoder().encode(text), { now })).toEqual(expected);
    expect(parseReadingPayload(text, { now })).toEqual(expected);
  });

  it('ignores a leading byte order mark in bytes and strings alike', () => {
    // RFC 8259 §8.1: a parser may ignore a byte order mark rather than treat it as an error.
    const text = `\ufeff${JSON.stringify(encodeReadingPack('van-1', [first]))}`;
    const expected = { deviceId: 'van-1', readings: [first] };
    expect(parseReadingPayload(new TextEncoder().encode(text), { now })).toEqual(expected);
    expect(parseReadingPayload(text, { now })).toEqual(expected);
  });

  it('refuses payloads over 64 KiB before parsing them', () => {
    const error = payloadRefusal(new Uint8Array(64 * 1024 + 1));
    expect(error.code).toBe('payload_too_large');
    expect(error.field).toBeUndefined();
    expect(payloadRefusal(`[${' '.repeat(64 * 1024)}]`).code).toBe('payload_too_large');
    // Multi-byte characters count by their UTF-8 size: 33 000 × "é" is 66 000 bytes in 33 000 code units.
    expect(payloadRefusal(`"${'é'.repeat(33_000)}"`).code).toBe('payload_too_large');
  });

  it('refuses text that is not JSON', () => {
    const error = payloadRefusal('[{"n":"voltage",');
    expect(error.code).toBe('payload_not_json');
    expect(error.cause).toBeInstanceOf(SyntaxError);
  });

  it('refuses bytes that are not UTF-8', () => {
    expect(payloadRefusal(new Uint8Array([0x5b, 0xff, 0x5d])).code).toBe('payload_not_utf8');
  });

  it('refuses JSON that is not a pack', () => {
    expect(payloadRefusal('{"n":"voltage"}').code).toBe('senml_not_array');
  });

  it('survives deeply nested JSON', () => {
    expect(payloadRefusal('['.repeat(30_000) + ']'.repeat(30_000)).code).toBe('senml_not_object');
  });
});

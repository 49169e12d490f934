import { encodeReadingPack, type BatteryReading } from '@cellwarden/shared';

/** One hand-picked payload and what must become of it: stored as sent, or refused with a stable code. */
export interface CorpusEntry {
  name: string;
  payload: string | Uint8Array;
  /** 'stored' or the refusal code. */
  outcome: string;
  /** For 'stored': the readings exactly as they must be stored. */
  readings?: BatteryReading[];
}

const MINUTE = 60_000;
const DAY = 24 * 60 * MINUTE;

/** The corpus for one device; `now` is the receiver's clock, `slot` spreads measured times so none collide. */
export function badPayloadCorpus(deviceId: string, now: number): CorpusEntry[] {
  let slot = 0;
  const at = () => now - 3 * 60 * MINUTE + ++slot * 1000;
  const reading = (over: Partial<BatteryReading> = {}): BatteryReading => ({
    measuredAt: at(),
    voltage: 26.4,
    current: -3.25,
    temperature: 14.5,
    ...over,
  });
  const bn = `urn:dev:cw:${deviceId}:`;
  const pack = (records: object[]) => JSON.stringify(records);
  const base = (t: number) => ({ bn, bt: t / 1000 });
  const one = (r: BatteryReading) => JSON.stringify(encodeReadingPack(deviceId, [r]));
  // Built once so two entries send the very same bytes.
  const twice = reading();
  const latest = reading({ measuredAt: now - 60 * MINUTE });
  const earlier = reading({ measuredAt: now - 150 * MINUTE });
  const bom = reading();
  const unusual = reading({ voltage: 51.2, current: 1999.5, temperature: -59.5, stateOfCharge: 0, power: 0 });
  const t = at();
  return [
    { name: 'valid reading', payload: one(twice), outcome: 'stored', readings: [twice] },
    // At-least-once delivery: the same pack again must not make a second row.
    { name: 'duplicate of a stored reading', payload: one(twice), outcome: 'stored', readings: [] },
    { name: 'newest first', payload: one(latest), outcome: 'stored', readings: [latest] },
    { name: 'older, after a newer one', payload: one(earlier), outcome: 'stored', readings: [earlier] },
    { name: 'edge values', payload: one(unusual), outcome: 'stored', readings: [unusual] },
    // RFC 8259 §6: NaN and Infinity are not JSON numbers, so such a pack is not JSON at all.
    { name: 'NaN literal', payload: one(reading()).replace('26.4', 'NaN'), outcome: 'payload_not_json' },
    {
      name: 'Infinity literal',
      payload: one(reading()).replace('26.4', 'Infinity'),
      outcome: 'payload_not_json',
    },
    // 1e999 is valid JSON syntax that parses to Infinity (ECMA-262 Number value rounding).
    {
      name: 'number overflowing to Infinity',
      payload: one(reading()).replace('26.4', '1e999'),
      outcome: 'senml_not_finite',
    },
    { name: 'huge voltage', payload: one(reading({ voltage: 1e12 })), outcome: 'out_of_range' },
    { name: 'negative voltage', payload: one(reading({ voltage: -12 })), outcome: 'out_of_range' },
    { name: 'current beyond 2000 A', payload: one(reading({ current: -2000.5 })), outcome: 'out_of_range' },
    { name: 'state of charge 101 %', payload: one(reading({ stateOfCharge: 101 })), outcome: 'out_of_range' },
    { name: 'millivolts as volts', payload: one(reading()).replace('"V"', '"mV"'), outcome: 'wrong_unit' },
    {
      name: 'temperature in Fahrenheit',
      payload: pack([
        { ...base(t), n: 'voltage', u: 'V', v: 26 },
        { n: 'current', u: 'A', v: 1 },
        { n: 'temperature', u: 'degF', v: 60 },
      ]),
      outcome: 'wrong_unit',
    },
    { name: 'unit missing', payload: pack([{ ...base(t), n: 'voltage', v: 26 }]), outcome: 'missing_unit' },
    {
      name: 'value as a string',
      payload: one(reading()).replace('26.4', '"26.4"'),
      outcome: 'senml_bad_type',
    },
    {
      name: 'a day in the future',
      payload: one(reading({ measuredAt: now + DAY })),
      outcome: 'too_far_in_future',
    },
    {
      name: 'five hundred days old',
      payload: one(reading({ measuredAt: now - 500 * DAY })),
      outcome: 'too_old',
    },
    {
      name: 'year 1970 (absolute time 2^28 s)',
      payload: one(reading({ measuredAt: 2 ** 28 * 1000 })),
      outcome: 'too_old',
    },
    {
      name: 'oversized payload',
      payload: pack([{ ...base(t), n: 'voltage', u: 'V', v: 26, vs: 'x'.repeat(70_000) }]),
      outcome: 'payload_too_large',
    },
    { name: 'malformed JSON', payload: '[{"bn":', outcome: 'payload_not_json' },
    { name: 'empty payload', payload: '', outcome: 'payload_not_json' },
    // RFC 8259 §8.1: a parser MAY ignore a leading byte order mark; the UTF-8 decoder does, so it is stored.
    {
      name: 'byte order mark',
      payload: new TextEncoder().encode(`\uFEFF${one(bom)}`),
      outcome: 'stored',
      readings: [bom],
    },
    {
      name: 'malformed UTF-8',
      payload: new Uint8Array([0x5b, 0xc3, 0x28, 0x5d]),
      outcome: 'payload_not_utf8',
    },
    { name: 'not an array', payload: '{"bn":"x"}', outcome: 'senml_not_array' },
    { name: 'empty pack', payload: '[]', outcome: 'senml_empty_pack' },
    {
      name: 'control character in a name',
      payload: pack([{ ...base(t), n: 'volt\u0000age', u: 'V', v: 26 }]),
      outcome: 'senml_bad_name',
    },
    {
      name: 'CR/LF in a name',
      payload: pack([{ ...base(t), n: 'voltage\r\nBcc: x', u: 'V', v: 26 }]),
      outcome: 'senml_bad_name',
    },
    // A Cyrillic "а" that looks like a Latin "a" in the device id.
    {
      name: 'look-alike letter in the base name',
      payload: pack([{ bn: bn.replace('a', '\u0430'), bt: t / 1000, n: 'voltage', u: 'V', v: 26 }]),
      outcome: 'senml_bad_name',
    },
    {
      name: 'emoji measurement name',
      payload: pack([{ ...base(t), n: '\u{1F50B}', u: 'V', v: 26 }]),
      outcome: 'senml_bad_name',
    },
    {
      name: 'another device named',
      payload: one(reading()).replace(deviceId, 'cw-someone-else'),
      outcome: 'wrong_device',
    },
    {
      name: 'unknown measurement',
      payload: pack([{ ...base(t), n: 'humidity', u: '%RH', v: 40 }]),
      outcome: 'unknown_measurement',
    },
    {
      name: 'voltage twice at one time',
      payload: pack([
        { ...base(t), n: 'voltage', u: 'V', v: 26 },
        { n: 'voltage', u: 'V', v: 27 },
      ]),
      outcome: 'duplicate_measurement',
    },
    {
      name: 'voltage alone',
      payload: pack([{ ...base(t), n: 'voltage', u: 'V', v: 26 }]),
      outcome: 'incomplete_reading',
    },
    // RFC 8428 §4.4: a label ending in "_" must be understood by the receiver or the pack refused.
    {
      name: 'must-understand label',
      payload: pack([{ ...base(t), n: 'voltage', u: 'V', v: 26, x_: 1 }]),
      outcome: 'senml_must_understand',
    },
    {
      name: 'future SenML version',
      payload: pack([{ ...base(t), bver: 99, n: 'voltage', u: 'V', v: 26 }]),
      outcome: 'senml_unsupported_version',
    },
  ];
}

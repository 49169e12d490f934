// The wire format of Cellwarden readings: one SenML JSON pack per publish, all records of one device.
import { BatteryReading } from '../telemetry/reading';
import { ReadingValidationError, validateReading } from '../telemetry/reading-validation';
import { quoteTime, quoteValue } from '../telemetry/telemetry-input-error';
import {
  DEVICE_NAME_PREFIX,
  isPackId,
  MAX_READING_PAYLOAD_BYTES,
  MEASUREMENT_UNITS,
  SOURCE_CURRENT_UNIT,
  SOURCE_MEASUREMENT_PREFIX,
  splitDeviceName,
  unitOfMeasurement,
} from './reading-measurement';
import { decodeCommonPack } from './common-pack';
import { resolvePack } from './resolve-pack';
import { SenmlError } from './senml-error';
import { ResolvedSenmlRecord, SenmlRecord } from './senml-record';

const REQUIRED_MEASUREMENTS = ['voltage', 'current', 'temperature'] as const;
const OPTIONAL_PROPERTIES = { soc: 'stateOfCharge', power: 'power' } as const;

/** One measurement found in a pack, with the index of its record for error paths. */
interface Measurement {
  value: number;
  index: number;
}

/** The records that share one measured time. */
interface PendingReading {
  measuredAt: number;
  measurements: Map<string, Measurement>;
}

/** Encodes readings of one device as a SenML pack: bn = `urn:dev:cw:${deviceId}:`, bt = first measuredAt (seconds, may be fractional), records V, A, Cel, %EL (state of charge), W (power), and per-source currents named `source:<id>` unit A. */
export function encodeReadingPack(deviceId: string, readings: readonly BatteryReading[]): SenmlRecord[] {
  checkId('deviceId', deviceId);
  if (readings.length === 0) {
    throw new SenmlError('senml_empty_pack', 'a reading pack needs at least one reading; got none');
  }
  const baseTime = readings[0].measuredAt;
  const records = readings.flatMap((reading) =>
    encodeReading(reading, (reading.measuredAt - baseTime) / 1000),
  );
  records[0] = { bn: `${DEVICE_NAME_PREFIX}${deviceId}:`, bt: baseTime / 1000, ...records[0] };
  return records;
}

function encodeReading(reading: BatteryReading, offsetSeconds: number): SenmlRecord[] {
  const values: [string, number | undefined][] = [
    ['voltage', reading.voltage],
    ['current', reading.current],
    ['temperature', reading.temperature],
    ['soc', reading.stateOfCharge],
    ['power', reading.power],
  ];
  const records: SenmlRecord[] = [];
  const time = offsetSeconds === 0 ? {} : { t: offsetSeconds };
  for (const [name, value] of values) {
    if (value !== undefined) records.push({ n: name, u: MEASUREMENT_UNITS[name], v: value, ...time });
  }
  for (const [sourceId, current] of Object.entries(reading.sourceCurrents ?? {})) {
    checkId(`sourceCurrents.${sourceId}`, sourceId);
    records.push({
      n: `${SOURCE_MEASUREMENT_PREFIX}${sourceId}`,
      u: SOURCE_CURRENT_UNIT,
      v: current,
      ...time,
    });
  }
  return records;
}

function checkId(field: string, id: string): void {
  if (!isPackId(id)) {
    throw new SenmlError(
      'senml_bad_name',
      `${field} must be letters, digits, ".", "_" or "-", starting with a letter or digit; got ${quoteValue(id)}`,
      { field },
    );
  }
}

/** Decodes and validates a pack (already JSON-parsed `unknown`) into readings grouped by measured time; throws SenmlError / ReadingValidationError with code+field. */
export function decodeReadingPack(
  pack: unknown,
  options: { now: number; expectedDeviceId?: string },
): { deviceId: string; readings: BatteryReading[] } {
  // The common pack in one pass; anything else, and every refusal, through the general path below.
  return decodeCommonPack(pack, options) ?? decodeReadingPackFully(pack, options);
}

/** `decodeReadingPack` the general way: every record resolved (RFC 8428 §4.6), then grouped and checked. */
export function decodeReadingPackFully(
  pack: unknown,
  options: { now: number; expectedDeviceId?: string },
): { deviceId: string; readings: BatteryReading[] } {
  const records = resolvePack(pack, { now: options.now / 1000 });
  if (records.length === 0) {
    throw new SenmlError('senml_empty_pack', 'a reading pack needs at least one record; got []');
  }
  const deviceId = packDeviceId(records[0], options.expectedDeviceId);
  const pending = new Map<number, PendingReading>();
  records.forEach((record, index) => addMeasurement(pending, record, index, deviceId));
  const readings = [...pending.values()].map((reading) => toReading(reading, options.now));
  return { deviceId, readings: readings.sort((a, b) => a.measuredAt - b.measuredAt) };
}

function packDeviceId(first: ResolvedSenmlRecord, expectedDeviceId: string | undefined): string {
  const deviceId = splitName(first, 0).deviceId;
  if (expectedDeviceId !== undefined && deviceId !== expectedDeviceId) {
    throw new SenmlError(
      'wrong_device',
      `[0] names device ${quoteValue(deviceId)} but was sent by ${quoteValue(expectedDeviceId)}`,
      { field: '[0].bn' },
    );
  }
  return deviceId;
}

function splitName(record: ResolvedSenmlRecord, index: number): { deviceId: string; measurement: string } {
  const parts = splitDeviceName(record.n);
  if (parts === undefined) {
    throw new SenmlError(
      'foreign_name',
      `[${index}] must resolve to ${DEVICE_NAME_PREFIX}<device id>:<measurement>; got ${quoteValue(record.n)}`,
      { field: `[${index}].n` },
    );
  }
  return parts;
}

function addMeasurement(
  pending: Map<number, PendingReading>,
  record: ResolvedSenmlRecord,
  index: number,
  deviceId: string,
): void {
  const path = `[${index}]`;
  const { deviceId: recordDevice, measurement } = splitName(record, index);
  if (recordDevice !== deviceId) {
    throw new SenmlError(
      'mixed_devices',
      `${path} names device ${quoteValue(recordDevice)} but [0] names ${quoteValue(deviceId)}`,
      { field: `${path}.n` },
    );
  }
  const value = measurementValue(record, measurement, path);
  const measuredAt = Math.round(record.t * 1000);
  const reading = pending.get(measuredAt) ?? { measuredAt, measurements: new Map<string, Measurement>() };
  if (reading.measurements.has(measurement)) {
    throw new SenmlError(
      'duplicate_measurement',
      `${path} repeats ${measurement} at ${quoteTime(measuredAt)}`,
      { field: `${path}.n` },
    );
  }
  reading.measurements.set(measurement, { value, index });
  pending.set(measuredAt, reading);
}

function measurementValue(record: ResolvedSenmlRecord, measurement: string, path: string): number {
  const unit = unitOfMeasurement(measurement);
  if (unit === undefined) {
    throw new SenmlError(
      'unknown_measurement',
      `${path} names unknown measurement ${quoteValue(measurement)}`,
      {
        field: `${path}.n`,
      },
    );
  }
  if (record.u === undefined) {
    throw new SenmlError('missing_unit', `${path} must give ${measurement} a unit of "${unit}"; got none`, {
      field: `${path}.u`,
    });
  }
  if (record.u !== unit) {
    throw new SenmlError(
      'wrong_unit',
      `${path}.u must be "${unit}" for ${measurement}; got ${quoteValue(record.u)}`,
      {
        field: `${path}.u`,
      },
    );
  }
  if (record.v === undefined) {
    throw new SenmlError('wrong_value_type', `${path} must carry ${measurement} as a number in v`, {
      field: path,
    });
  }
  return record.v;
}

function toReading(pending: PendingReading, now: number): BatteryReading {
  const { measuredAt, measurements } = pending;
  const missing = REQUIRED_MEASUREMENTS.filter((name) => !measurements.has(name));
  const first = Math.min(...[...measurements.values()].map((measurement) => measurement.index));
  if (missing.length > 0) {
    throw new SenmlError(
      'incomplete_reading',
      `reading at ${quoteTime(measuredAt)} needs voltage, current and temperature; missing ${missing.join(', ')}`,
      { field: `[${first}]` },
    );
  }
  const reading = assembleReading(measuredAt, measurements);
  try {
    validateReading(reading, { now });
  } catch (error) {
    if (!(error instanceof ReadingValidationError)) throw error;
    // Point at the record that carried the bad value, so the device's owner can find it in the payload.
    const field = recordPath(error.field, measurements, first);
    throw new ReadingValidationError(error.code, error.message, { field, cause: error });
  }
  return reading;
}

function assembleReading(measuredAt: number, measurements: Map<string, Measurement>): BatteryReading {
  const valueOf = (name: string): number | undefined => measurements.get(name)?.value;
  const reading: BatteryReading = {
    measuredAt,
    voltage: valueOf('voltage') as number,
    current: valueOf('current') as number,
    temperature: valueOf('temperature') as number,
  };
  for (const [measurement, property] of Object.entries(OPTIONAL_PROPERTIES)) {
    const value = valueOf(measurement);
    if (value !== undefined) reading[property] = value;
  }
  for (const [measurement, { value }] of measurements) {
    if (!measurement.startsWith(SOURCE_MEASUREMENT_PREFIX)) continue;
    reading.sourceCurrents ??= {};
    reading.sourceCurrents[measurement.slice(SOURCE_MEASUREMENT_PREFIX.length)] = value;
  }
  return reading;
}

function recordPath(
  field: string | undefined,
  measurements: Map<string, Measurement>,
  first: number,
): string {
  if (field === undefined || field === 'measuredAt') return `[${first}].t`;
  const property = Object.entries(OPTIONAL_PROPERTIES).find(([, name]) => name === field);
  const measurement = field.startsWith('sourceCurrents.')
    ? `${SOURCE_MEASUREMENT_PREFIX}${field.slice('sourceCurrents.'.length)}`
    : (property?.[0] ?? field);
  const index = measurements.get(measurement)?.index;
  return index === undefined ? `[${first}]` : `[${index}].v`;
}

/** Parses raw MQTT payload bytes (Uint8Array) or a string: size limit (e.g. 64 KiB → code 'payload_too_large'), JSON parse errors → code 'payload_not_json', then decodeReadingPack. */
export function parseReadingPayload(
  payload: Uint8Array | string,
  options: { now: number; expectedDeviceId?: string },
): { deviceId: string; readings: BatteryReading[] } {
  const text = payloadText(payload);
  let pack: unknown;
  try {
    pack = JSON.parse(text);
  } catch (cause) {
    const reason = cause instanceof Error ? cause.message : String(cause);
    throw new SenmlError('payload_not_json', `payload must be SenML JSON; ${reason}`, { cause });
  }
  return decodeReadingPack(pack, options);
}

// RFC 8259 §8.1: JSON exchanged between systems is UTF-8; fatal refuses malformed bytes instead of silently
// replacing them. One decoder for every payload: a decode without `stream` starts afresh each time.
const UTF8 = new TextDecoder('utf-8', { fatal: true });

function payloadText(payload: Uint8Array | string): string {
  const size = payloadSize(payload);
  if (size > MAX_READING_PAYLOAD_BYTES) {
    throw new SenmlError(
      'payload_too_large',
      `payload must be at most ${MAX_READING_PAYLOAD_BYTES} bytes; got at least ${size}`,
    );
  }
  // RFC 8259 §8.1: a parser may ignore a leading byte order mark; the byte form loses it in TextDecoder.
  if (typeof payload === 'string') return payload.startsWith('\ufeff') ? payload.slice(1) : payload;
  try {
    return UTF8.decode(payload);
  } catch (cause) {
    throw new SenmlError('payload_not_utf8', 'payload must be UTF-8 text; got malformed bytes', { cause });
  }
}

function payloadSize(payload: Uint8Array | string): number {
  if (typeof payload !== 'string') return payload.byteLength;
  // UTF-8 never takes fewer bytes than UTF-16 code units, so a long string is refused before encoding it.
  if (payload.length > MAX_READING_PAYLOAD_BYTES) return payload.length;
  return new TextEncoder().encode(payload).byteLength;
}

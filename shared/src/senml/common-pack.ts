// The pack nearly every monitor sends, read in one pass: base name and base time in the first record only, then
// records of one device's measurements in time order, each with its name, unit, value and optional time. The
// general path (resolve every record per RFC 8428 §4.6, then group and check them) makes several objects and
// strings per record; this one makes one object per reading. It never refuses: anything it is not sure of
// (an error, or a rarer but valid shape such as a later base field, a sum or records out of time order) returns
// undefined, and the general path decides and names the offending field. Its spec checks that both agree.
import { BatteryReading } from '../telemetry/reading';
import { ReadingValidationError, validateReading } from '../telemetry/reading-validation';
import {
  DEVICE_NAME_PREFIX,
  isPackId,
  SOURCE_CURRENT_UNIT,
  SOURCE_MEASUREMENT_PREFIX,
} from './reading-measurement';
import { isSenmlName } from './senml-name';
import { RELATIVE_TIME_LIMIT, SENML_VERSION } from './senml-record';

// Read once: the module bindings above are getters in the compiled code, and these are read per record.
const RELATIVE_LIMIT = RELATIVE_TIME_LIMIT;
const VERSION = SENML_VERSION;
const NAME_PREFIX = DEVICE_NAME_PREFIX;
const SOURCE_PREFIX = SOURCE_MEASUREMENT_PREFIX;
const SOURCE_UNIT = SOURCE_CURRENT_UNIT;

/** The reading being gathered from the records that share its measured time. */
interface Gathering {
  measuredAt: number;
  voltage?: number;
  current?: number;
  temperature?: number;
  stateOfCharge?: number;
  power?: number;
  sourceCurrents?: Record<string, number>;
}

const isFiniteNumber = (value: unknown): value is number =>
  typeof value === 'number' && Number.isFinite(value);

/**
 * The readings of a common pack (already JSON-parsed), exactly as `decodeReadingPackFully` would return them,
 * or undefined when the pack is not of the common shape or not valid (the general path then decides).
 */
export function decodeCommonPack(
  pack: unknown,
  options: { now: number; expectedDeviceId?: string },
): { deviceId: string; readings: BatteryReading[] } | undefined {
  if (!Array.isArray(pack) || pack.length === 0) return undefined;
  const first: unknown = pack[0];
  if (typeof first !== 'object' || first === null || Array.isArray(first)) return undefined;
  const base = first as Record<string, unknown>;
  const baseName = base['bn'];
  if (typeof baseName !== 'string' || !baseName.startsWith(NAME_PREFIX) || !isSenmlName(baseName))
    return undefined;
  // The base name is the whole device part (`urn:dev:cw:<id>:`), so every record's name is a measurement.
  const colon = baseName.indexOf(':', NAME_PREFIX.length);
  if (colon !== baseName.length - 1) return undefined;
  const deviceId = baseName.slice(NAME_PREFIX.length, colon);
  if (!isPackId(deviceId)) return undefined;
  if (options.expectedDeviceId !== undefined && deviceId !== options.expectedDeviceId) return undefined;

  const nowSeconds = options.now / 1000;
  let baseTime = 0;
  let baseUnit: string | undefined;
  let baseValue = 0;
  let previousTime = Number.NEGATIVE_INFINITY;
  const readings: BatteryReading[] = [];
  let gathering: Gathering | undefined;

  for (let index = 0; index < pack.length; index++) {
    const item: unknown = pack[index];
    if (typeof item !== 'object' || item === null || Array.isArray(item)) return undefined;
    const record = item as Record<string, unknown>;
    let name: string | undefined;
    let unit: string | undefined;
    let value: number | undefined;
    let time = 0;
    for (const label in record) {
      const labelValue = record[label];
      switch (label) {
        case 'n':
          if (typeof labelValue !== 'string') return undefined;
          name = labelValue;
          break;
        case 'u':
          if (typeof labelValue !== 'string') return undefined;
          unit = labelValue;
          break;
        case 'v':
          if (!isFiniteNumber(labelValue)) return undefined;
          value = labelValue;
          break;
        case 't':
          if (!isFiniteNumber(labelValue)) return undefined;
          time = labelValue;
          break;
        case 'ut':
          if (!isFiniteNumber(labelValue)) return undefined;
          break;
        case 'bn':
          if (index !== 0) return undefined;
          break;
        case 'bt':
          if (index !== 0 || !isFiniteNumber(labelValue)) return undefined;
          baseTime = labelValue;
          break;
        case 'bv':
          if (index !== 0 || !isFiniteNumber(labelValue)) return undefined;
          baseValue = labelValue;
          break;
        case 'bu':
          if (index !== 0 || typeof labelValue !== 'string') return undefined;
          baseUnit = labelValue;
          break;
        case 'bver':
          if (index !== 0 || !Number.isInteger(labelValue)) return undefined;
          if ((labelValue as number) < 1 || (labelValue as number) > VERSION) return undefined;
          break;
        default:
          // Sums, other kinds of value and must-understand labels go the general way; other labels are ignored.
          if (label === 's' || label === 'bs' || label === 'vs' || label === 'vb' || label === 'vd')
            return undefined;
          if (label.endsWith('_')) return undefined;
      }
    }
    if (name === undefined || value === undefined) return undefined;
    const expectedUnit = unitOf(name);
    if (expectedUnit === undefined || (unit ?? baseUnit) !== expectedUnit) return undefined;
    const sum = baseValue + value;
    if (!Number.isFinite(sum)) return undefined;
    let at = baseTime + time;
    if (!Number.isFinite(at)) return undefined;
    if (at < RELATIVE_LIMIT) at = nowSeconds + at;
    // Records out of time order are put in order by the general path.
    if (at < previousTime) return undefined;
    previousTime = at;
    const measuredAt = Math.round(at * 1000);
    if (gathering === undefined || gathering.measuredAt !== measuredAt) {
      if (gathering !== undefined && !finish(gathering, readings, options.now)) return undefined;
      gathering = { measuredAt };
    }
    if (!gather(gathering, name, sum)) return undefined;
  }
  if (gathering === undefined || !finish(gathering, readings, options.now)) return undefined;
  return { deviceId, readings };
}

/** The unit a measurement name must carry, or undefined (not part of the profile). */
function unitOf(name: string): string | undefined {
  switch (name) {
    case 'voltage':
      return 'V';
    case 'current':
      return 'A';
    case 'temperature':
      return 'Cel';
    case 'soc':
      return '%EL';
    case 'power':
      return 'W';
  }
  return name.startsWith(SOURCE_PREFIX) && isPackId(name.slice(SOURCE_PREFIX.length))
    ? SOURCE_UNIT
    : undefined;
}

/** Adds one measurement; false when the reading already has it. */
function gather(reading: Gathering, name: string, value: number): boolean {
  switch (name) {
    case 'voltage':
      if (reading.voltage !== undefined) return false;
      reading.voltage = value;
      return true;
    case 'current':
      if (reading.current !== undefined) return false;
      reading.current = value;
      return true;
    case 'temperature':
      if (reading.temperature !== undefined) return false;
      reading.temperature = value;
      return true;
    case 'soc':
      if (reading.stateOfCharge !== undefined) return false;
      reading.stateOfCharge = value;
      return true;
    case 'power':
      if (reading.power !== undefined) return false;
      reading.power = value;
      return true;
  }
  const sourceId = name.slice(SOURCE_PREFIX.length);
  const sources = (reading.sourceCurrents ??= {});
  if (Object.hasOwn(sources, sourceId)) return false;
  sources[sourceId] = value;
  return true;
}

/** Appends the complete, plausible reading (properties in the general path's order); false otherwise. */
function finish(gathering: Gathering, readings: BatteryReading[], now: number): boolean {
  const { measuredAt, voltage, current, temperature } = gathering;
  if (voltage === undefined || current === undefined || temperature === undefined) return false;
  const reading: BatteryReading = { measuredAt, voltage, current, temperature };
  if (gathering.stateOfCharge !== undefined) reading.stateOfCharge = gathering.stateOfCharge;
  if (gathering.power !== undefined) reading.power = gathering.power;
  if (gathering.sourceCurrents !== undefined) reading.sourceCurrents = gathering.sourceCurrents;
  try {
    validateReading(reading, { now });
  } catch (error) {
    if (error instanceof ReadingValidationError) return false;
    throw error;
  }
  readings.push(reading);
  return true;
}

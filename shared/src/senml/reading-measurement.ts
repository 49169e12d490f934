// Cellwarden's reading profile of SenML: which record names a device may send and the unit each must carry.
// Names resolve to `urn:dev:cw:<device id>:<measurement>`, so ids must stay inside the RFC 8428 §4.5.1
// character set and must not contain ":" (which would make the split ambiguous).

/** Base-name prefix of every Cellwarden device: a URN in the `urn:dev` style of RFC 9039. */
export const DEVICE_NAME_PREFIX = 'urn:dev:cw:';

/** Prefix of a per-source current record, e.g. `source:solar`. */
export const SOURCE_MEASUREMENT_PREFIX = 'source:';

/** The fixed measurements of a reading pack and the SenML unit each must carry. */
export const MEASUREMENT_UNITS: Readonly<Record<string, string>> = {
  voltage: 'V',
  current: 'A',
  temperature: 'Cel',
  soc: '%EL',
  power: 'W',
};

/** Unit of a per-source current record. */
export const SOURCE_CURRENT_UNIT = 'A';

/** Largest reading payload accepted, bytes: hundreds of readings, well below a broker's packet limit. */
export const MAX_READING_PAYLOAD_BYTES = 64 * 1024;

const ID_PATTERN = /^[A-Za-z0-9][A-Za-z0-9._-]*$/;

/** Whether a device or charge-source id can appear in a reading pack's record names. */
export function isPackId(id: string): boolean {
  return ID_PATTERN.test(id);
}

/** The unit a measurement name must carry, or undefined when the name is not part of the profile. */
export function unitOfMeasurement(measurement: string): string | undefined {
  if (Object.hasOwn(MEASUREMENT_UNITS, measurement)) return MEASUREMENT_UNITS[measurement];
  if (!measurement.startsWith(SOURCE_MEASUREMENT_PREFIX)) return undefined;
  return isPackId(measurement.slice(SOURCE_MEASUREMENT_PREFIX.length)) ? SOURCE_CURRENT_UNIT : undefined;
}

/** Splits a resolved name into device id and measurement, or undefined when it is not a Cellwarden name. */
export function splitDeviceName(name: string): { deviceId: string; measurement: string } | undefined {
  if (!name.startsWith(DEVICE_NAME_PREFIX)) return undefined;
  const rest = name.slice(DEVICE_NAME_PREFIX.length);
  const colon = rest.indexOf(':');
  if (colon < 0) return undefined;
  const deviceId = rest.slice(0, colon);
  return isPackId(deviceId) ? { deviceId, measurement: rest.slice(colon + 1) } : undefined;
}

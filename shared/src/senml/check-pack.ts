// Structural checks of a JSON-parsed SenML pack (RFC 8428 §4, §5): types of every known label, finite
// numbers, must-understand labels, version, and one value per record. Name and time need resolution first.
import { quoteValue } from '../telemetry/telemetry-input-error';
import { SENML_VERSION, SenmlRecord } from './senml-record';
import { SenmlError, wrongTypeError } from './senml-error';

const NUMBER_LABELS = ['bt', 'bv', 'bs', 'bver', 'v', 's', 't', 'ut'] as const;
const STRING_LABELS = ['bn', 'bu', 'n', 'u', 'vs', 'vd'] as const;
const VALUE_LABELS = ['v', 'vs', 'vb', 'vd'] as const;
// RFC 8428 §5: vd is base64url (RFC 4648 §5) without padding in SenML JSON.
const BASE64URL_UNPADDED = /^[A-Za-z0-9_-]*$/;

/** The records of a pack (already JSON-parsed), or a SenmlError naming the first offending label. */
export function checkPack(pack: unknown): SenmlRecord[] {
  if (!Array.isArray(pack)) {
    throw new SenmlError('senml_not_array', `a SenML pack must be a JSON array; got ${quoteValue(pack)}`);
  }
  return pack.map((record: unknown, index) => checkRecord(record, `[${index}]`));
}

function checkRecord(value: unknown, path: string): SenmlRecord {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    throw new SenmlError('senml_not_object', `${path} must be a JSON object; got ${quoteValue(value)}`, {
      field: path,
    });
  }
  const input = value as Record<string, unknown>;
  checkNoMustUnderstand(input, path);
  const record = copyLabels(input, path);
  checkVersion(record, path);
  checkValueCount(record, path);
  if (record.vd !== undefined && !BASE64URL_UNPADDED.test(record.vd)) {
    throw new SenmlError(
      'senml_bad_data_value',
      `${path}.vd must be base64url without padding; got ${quoteValue(record.vd)}`,
      { field: `${path}.vd` },
    );
  }
  return record;
}

function checkNoMustUnderstand(input: Record<string, unknown>, path: string): void {
  // RFC 8428 §4.4: a label ending in "_" must be understood; we understand none, so the pack is refused.
  const label = Object.keys(input).find((key) => key.endsWith('_'));
  if (label !== undefined) {
    throw new SenmlError(
      'senml_must_understand',
      `${path} carries must-understand label ${quoteValue(label)}, which is not supported`,
      { field: `${path}.${label}` },
    );
  }
}

function copyLabels(input: Record<string, unknown>, path: string): SenmlRecord {
  const record: Record<string, unknown> = {};
  for (const label of NUMBER_LABELS) {
    if (!Object.hasOwn(input, label)) continue;
    const value = input[label];
    if (typeof value !== 'number') throw wrongTypeError(`${path}.${label}`, 'a number', value);
    if (!Number.isFinite(value)) {
      throw new SenmlError('senml_not_finite', `${path}.${label} must be finite; got ${value}`, {
        field: `${path}.${label}`,
      });
    }
    record[label] = value;
  }
  for (const label of STRING_LABELS) {
    if (!Object.hasOwn(input, label)) continue;
    if (typeof input[label] !== 'string') throw wrongTypeError(`${path}.${label}`, 'a string', input[label]);
    record[label] = input[label];
  }
  if (Object.hasOwn(input, 'vb')) {
    if (typeof input['vb'] !== 'boolean') throw wrongTypeError(`${path}.vb`, 'true or false', input['vb']);
    record['vb'] = input['vb'];
  }
  return record as SenmlRecord;
}

function checkVersion(record: SenmlRecord, path: string): void {
  if (record.bver === undefined) return;
  if (!Number.isInteger(record.bver) || record.bver < 1) {
    throw wrongTypeError(`${path}.bver`, 'a positive integer', record.bver);
  }
  // RFC 8428 §4.4: a version larger than the one understood must not be used.
  if (record.bver > SENML_VERSION) {
    throw new SenmlError(
      'senml_unsupported_version',
      `${path}.bver must be at most ${SENML_VERSION}; got ${record.bver}`,
      { field: `${path}.bver` },
    );
  }
}

function checkValueCount(record: SenmlRecord, path: string): void {
  const present = VALUE_LABELS.filter((label) => record[label] !== undefined);
  // RFC 8428 §4.2: exactly one value field, unless a sum is present, in which case none is allowed.
  if (present.length > 1) {
    throw new SenmlError(
      'senml_multiple_values',
      `${path} must carry only one of v, vs, vb, vd; got ${present.join(', ')}`,
      { field: `${path}.${present[1]}` },
    );
  }
  // RFC 8428 §4.5.4: a base sum in the record gives it a sum even without its own s.
  if (present.length === 0 && record.s === undefined && record.bs === undefined) {
    throw new SenmlError('senml_no_value', `${path} must carry one of v, vs, vb, vd or s; got none`, {
      field: path,
    });
  }
}

// The SenML data model of RFC 8428 as it appears in SenML JSON (§5): one pack is an array of records.

/** One SenML record as sent, base fields included (RFC 8428 §4.1, §4.2; JSON labels of §5 Table 4). */
export interface SenmlRecord {
  /** Base Name, prefixed to this and later records' names. */
  bn?: string;
  /** Base Time, seconds, added to this and later records' times. */
  bt?: number;
  /** Base Unit, used by records that carry no unit of their own. */
  bu?: string;
  /** Base Value, added to this and later records' numeric values. */
  bv?: number;
  /** Base Sum, added to this and later records' sums. */
  bs?: number;
  /** Base Version; absent means the version of RFC 8428 itself, 10. */
  bver?: number;
  /** Name, appended to the base name. */
  n?: string;
  /** Unit, from the SenML units registry (e.g. `V`, `A`, `Cel`, `%EL`, `W`). */
  u?: string;
  /** Numeric value. */
  v?: number;
  /** String value. */
  vs?: string;
  /** Boolean value. */
  vb?: boolean;
  /** Data value: base64url without padding in JSON. */
  vd?: string;
  /** Sum of the value over time. */
  s?: number;
  /** Time, seconds; absolute from 2^28 upwards, relative to now below it. */
  t?: number;
  /** Update time: the longest the sender will wait, in seconds, before sending a fresh record. */
  ut?: number;
}

/** A record after RFC 8428 §4.6 resolution: full name, absolute time, no base fields except a non-default bver. */
export interface ResolvedSenmlRecord {
  /** Base name and name concatenated. */
  n: string;
  /** Absolute time, seconds since the Unix epoch. */
  t: number;
  u?: string;
  v?: number;
  vs?: string;
  vb?: boolean;
  vd?: string;
  s?: number;
  ut?: number;
  /** Present only when the pack is not SenML version 10. */
  bver?: number;
}

/** The SenML version RFC 8428 defines; a pack claiming a later one must not be used (§4.4). */
export const SENML_VERSION = 10;

/** Times below 2^28 seconds are relative to the receiver's now (RFC 8428 §4.5.3). */
export const RELATIVE_TIME_LIMIT = 2 ** 28;

// RFC 8428 §4.6: turns a pack into resolved records, applying base fields the way §4.1 describes — each
// base field holds from its record onwards until a later record sets the same base field again — and puts
// the resolved records in chronological order.
import { checkPack } from './check-pack';
import { badNameError, SenmlError } from './senml-error';
import { isSenmlName } from './senml-name';
import { RELATIVE_TIME_LIMIT, ResolvedSenmlRecord, SENML_VERSION, SenmlRecord } from './senml-record';

interface BaseFields {
  bn: string;
  bt: number;
  bu?: string;
  bv: number;
  /** Undefined until a record sets it: a base sum, once present, gives every later record a sum (§4.5.4). */
  bs?: number;
  bver: number;
}

/** Checks and resolves a JSON-parsed pack; `now` is the receiver's clock in seconds since the epoch. */
export function resolvePack(pack: unknown, options: { now: number }): ResolvedSenmlRecord[] {
  const records = checkPack(pack);
  const base: BaseFields = { bn: '', bt: 0, bv: 0, bver: SENML_VERSION };
  const resolved = records.map((record, index) => {
    carryBaseFields(base, record);
    return resolveRecord(record, base, options.now, `[${index}]`);
  });
  // RFC 8428 §4.6: resolved records are in chronological order; the sort is stable, so records of one
  // instant keep the order the sender gave them.
  return resolved.sort((a, b) => a.t - b.t);
}

function carryBaseFields(base: BaseFields, record: SenmlRecord): void {
  if (record.bn !== undefined) base.bn = record.bn;
  if (record.bt !== undefined) base.bt = record.bt;
  if (record.bu !== undefined) base.bu = record.bu;
  if (record.bv !== undefined) base.bv = record.bv;
  if (record.bs !== undefined) base.bs = record.bs;
  if (record.bver !== undefined) base.bver = record.bver;
}

function resolveRecord(
  record: SenmlRecord,
  base: BaseFields,
  now: number,
  path: string,
): ResolvedSenmlRecord {
  const name = base.bn + (record.n ?? '');
  // RFC 8428 §4.5.1: the rules apply to the concatenated name, so the field to blame is n, or bn without n.
  if (!isSenmlName(name)) throw badNameError(`${path}.${record.n === undefined ? 'bn' : 'n'}`, name);
  const resolved: ResolvedSenmlRecord = { n: name, t: resolveTime(record, base, now, path) };
  const unit = record.u ?? base.bu;
  if (unit !== undefined) resolved.u = unit;
  if (record.v !== undefined) resolved.v = finiteSum(base.bv, record.v, `${path}.v`);
  if (record.vs !== undefined) resolved.vs = record.vs;
  if (record.vb !== undefined) resolved.vb = record.vb;
  if (record.vd !== undefined) resolved.vd = record.vd;
  // RFC 8428 §4.5.4: if only one of Base Sum or Sum is present the missing one counts as zero; with neither,
  // the record has no sum.
  if (record.s !== undefined || base.bs !== undefined) {
    resolved.s = finiteSum(base.bs ?? 0, record.s ?? 0, `${path}.s`);
  }
  if (record.ut !== undefined) resolved.ut = record.ut;
  // RFC 8428 §4.6: bver is left out of resolved records of version 10 and kept in all others.
  if (base.bver !== SENML_VERSION) resolved.bver = base.bver;
  return resolved;
}

function resolveTime(record: SenmlRecord, base: BaseFields, now: number, path: string): number {
  const time = finiteSum(base.bt, record.t ?? 0, `${path}.t`);
  // RFC 8428 §4.5.3: below 2^28 a time is relative to now (0 = "roughly now"); from 2^28 on it is absolute.
  return time < RELATIVE_TIME_LIMIT ? now + time : time;
}

function finiteSum(baseValue: number, value: number, field: string): number {
  const sum = baseValue + value;
  if (!Number.isFinite(sum)) {
    throw new SenmlError('senml_not_finite', `${field} plus its base must be finite; got ${sum}`, { field });
  }
  return sum;
}

import type { ChargeSource, CommissioningCheck, SystemSettings } from '@cellwarden/shared';

/** One finished check as the record prints it. */
export interface CommissioningRecordCheck {
  /** The charge source's label (or id when it has none). */
  source: string;
  ratedCurrentA: number;
  tolerancePercent: number;
  windowSeconds: number;
  meanCurrentA: number | null;
  minCurrentA: number | null;
  maxCurrentA: number | null;
  ripplePeakToPeakA: number | null;
  batteryVoltageReached: number | null;
  cableDropV: number | null;
  verdict: 'PASS' | 'FAIL';
  reasons: string[];
}

/** A photo of the installation: JPEG or PNG bytes (null when the stored file could not be read) and a caption. */
export interface CommissioningRecordPhoto {
  caption: string;
  data: Buffer | null;
}

/** Everything a commissioning record shows; the caller has already checked who may see it. */
export interface CommissioningRecordInput {
  system: {
    name: string;
    kind: SystemSettings['kind'];
    battery: SystemSettings['battery'];
    bms: { continuousDischargeA: number };
    chargeSources: Pick<ChargeSource, 'id' | 'kind' | 'label' | 'ratedCurrentA'>[];
  };
  installer: { name: string; company: string };
  /** When the record was made, ms since the epoch. */
  recordedAt: number;
  /** IANA zone for the date; UTC when absent. */
  timeZone?: string;
  checks: CommissioningRecordCheck[];
  photos: CommissioningRecordPhoto[];
}

/** A finished API check as a record line; running or abandoned checks have no verdict and give null. */
export function toRecordCheck(
  check: CommissioningCheck,
  sources: Pick<ChargeSource, 'id' | 'label'>[],
): CommissioningRecordCheck | null {
  if (check.status !== 'passed' && check.status !== 'failed') return null;
  const result = check.result;
  return {
    source: sources.find((s) => s.id === check.sourceId)?.label || check.sourceId,
    ratedCurrentA: check.ratedCurrentA,
    tolerancePercent: check.tolerancePercent,
    windowSeconds: check.progress.secondsNeeded,
    meanCurrentA: result?.meanCurrentA ?? null,
    minCurrentA: result?.minCurrentA ?? null,
    maxCurrentA: result?.maxCurrentA ?? null,
    ripplePeakToPeakA: result?.ripplePeakToPeakA ?? null,
    batteryVoltageReached: result?.batteryVoltageReached ?? null,
    cableDropV: result?.cableDropV ?? null,
    verdict: check.status === 'passed' ? 'PASS' : 'FAIL',
    reasons: result?.reasons ?? [],
  };
}

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
  /** When the check started and finished, ms (absent in records made before the chart). */
  startedAt?: number;
  finishedAt?: number | null;
  /** Current (the source's when the monitor reports it, else the pack's) and voltage over the window. */
  chart?: RecordChartPoint[];
}

/** One point of a check's chart. */
export interface RecordChartPoint {
  at: number;
  currentA: number;
  voltage: number;
}

/** One registered component as the record lists it. */
export interface RecordComponent {
  name: string;
  kind: string;
  /** Its ratings in words (`200 Ah LiFePO4, BMS 200 A continuous, 300 A peak`). */
  ratings: string;
}

/** One registered circuit as the record's table shows it. */
export interface RecordCircuit {
  name: string;
  feeds: string;
  conductor: string;
  protection: string;
  fuseDistance: string;
  verdict: 'PASS' | 'FAIL';
  summary: string;
  rule: string;
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
  /** The system's owner, for the cover and the signature. */
  owner?: { name: string; email: string };
  /** The install register, when there is one. */
  components?: RecordComponent[];
  circuits?: RecordCircuit[];
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
    startedAt: check.startedAt,
    finishedAt: check.finishedAt,
  };
}

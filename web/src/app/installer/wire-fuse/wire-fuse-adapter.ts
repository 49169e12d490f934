import {
  AwgSize,
  InstallerInputError,
  InsulationRatingC,
  SystemVoltage,
  WireFuseCheckResult,
  checkWireAndFuse,
} from '@cellwarden/shared';

/** The wire & fuse form's raw values (numbers typed by a person may be null while empty). */
export interface WireFuseFormValue {
  currentA: number | null;
  oneWayLengthM: number | null;
  systemVoltage: SystemVoltage;
  allowedDropPercent: 3 | 10;
  insulationRatingC: InsulationRatingC;
  proposedGauge: AwgSize | '';
  proposedFuseA: number | null;
}

/** The check's answer, or the refused field and why. */
export type WireFuseOutcome =
  { kind: 'result'; result: WireFuseCheckResult } | { kind: 'refused'; field: string; message: string };

/** The one place the screen calls the shared wire & fuse check: maps the form to its input, catches refusals. */
export function runWireFuseCheck(value: WireFuseFormValue): WireFuseOutcome {
  try {
    const result = checkWireAndFuse({
      currentA: value.currentA ?? NaN,
      oneWayLengthM: value.oneWayLengthM ?? NaN,
      systemVoltage: value.systemVoltage,
      allowedDropPercent: value.allowedDropPercent,
      insulationRatingC: value.insulationRatingC,
      proposedGauge: value.proposedGauge === '' ? undefined : value.proposedGauge,
      proposedFuseA: value.proposedFuseA ?? undefined,
    });
    return { kind: 'result', result };
  } catch (error) {
    if (error instanceof InstallerInputError)
      return { kind: 'refused', field: error.field, message: error.message };
    throw error;
  }
}

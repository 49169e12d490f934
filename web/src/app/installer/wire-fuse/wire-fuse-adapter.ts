import {
  AwgSize,
  Chemistry,
  ConductorConstruction,
  InstallerInputError,
  InsulationRatingC,
  ProtectionRules,
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
  construction: ConductorConstruction;
  conductorTemperatureC: number | null;
  rules: ProtectionRules;
  ambientC: number | null;
  engineSpace: boolean;
  bundledConductors: number | null;
  sheathed: boolean;
  fuseDistanceM: number | null;
  bankChemistry: Chemistry | '';
  bankCapacityAh: number | null;
  proposedGauge: AwgSize | '';
  proposedFuseA: number | null;
  fuseInterruptingRatingA: number | null;
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
      construction: value.construction,
      conductorTemperatureC: value.conductorTemperatureC ?? NaN,
      rules: value.rules,
      ambientC: value.ambientC ?? NaN,
      engineSpace: value.engineSpace,
      bundledConductors: value.bundledConductors ?? NaN,
      sheathed: value.sheathed,
      fuseDistanceM: value.fuseDistanceM ?? undefined,
      bank:
        value.bankChemistry === ''
          ? undefined
          : { chemistry: value.bankChemistry, capacityAh: value.bankCapacityAh ?? NaN },
      proposedGauge: value.proposedGauge === '' ? undefined : value.proposedGauge,
      proposedFuseA: value.proposedFuseA ?? undefined,
      fuseInterruptingRatingA: value.fuseInterruptingRatingA ?? undefined,
    });
    return { kind: 'result', result };
  } catch (error) {
    if (error instanceof InstallerInputError)
      return { kind: 'refused', field: error.field, message: error.message };
    throw error;
  }
}

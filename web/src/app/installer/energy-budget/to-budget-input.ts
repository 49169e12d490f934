import type {
  BudgetLoad,
  BudgetSource,
  Chemistry,
  EnergyBudgetInput,
  SystemVoltage,
} from '@cellwarden/shared';

/** One load row as the editor holds it (percentages, as people type them). */
export interface LoadRow {
  name: string;
  watts: number;
  ac: boolean;
  hoursPerDay: number;
  dutyPercent: number;
}

/** One source row: `rating` is W for solar, A for chargers; `hours` is peak sun hours or hours a day. */
export interface SourceRow {
  kind: 'solar' | 'dc-dc' | 'shore';
  rating: number;
  hours: number;
}

/** The system block of the editor. */
export interface BudgetSystemRow {
  nominalVoltage: SystemVoltage;
  inverterEfficiencyPercent: number;
  inverterRatedW: number;
  bmsContinuousA: number;
  usablePercent: number;
  daysOfAutonomy: number;
  batteryCapacityAh: number | null;
  chemistry: Chemistry;
  inverterStandbyW: number;
  inverterStandbyHoursPerDay: number;
  inverterSurgeW: number | null;
  bmsPeakA: number | null;
}

/** The whole editor's value. */
export interface BudgetEditorValue {
  loads: LoadRow[];
  sources: SourceRow[];
  system: BudgetSystemRow;
}

/** Maps the editor's rows to the shared budget input (percent → fraction, rating → W or A). */
export function toBudgetInput(value: BudgetEditorValue): EnergyBudgetInput {
  const loads: BudgetLoad[] = value.loads.map((row) => ({
    name: row.name.trim(),
    watts: row.watts,
    ac: row.ac,
    hoursPerDay: row.hoursPerDay,
    dutyCycle: row.dutyPercent / 100,
  }));
  const sources: BudgetSource[] = value.sources.map((row) =>
    row.kind === 'solar'
      ? { kind: 'solar', watts: row.rating, peakSunHours: row.hours }
      : { kind: row.kind, amps: row.rating, hoursPerDay: row.hours },
  );
  const { system } = value;
  return {
    loads,
    sources,
    system: {
      nominalVoltage: system.nominalVoltage,
      inverterEfficiency: system.inverterEfficiencyPercent / 100,
      inverterRatedW: system.inverterRatedW,
      bmsContinuousA: system.bmsContinuousA,
      usableFraction: system.usablePercent / 100,
      daysOfAutonomy: system.daysOfAutonomy,
      batteryCapacityAh: system.batteryCapacityAh ?? undefined,
      chemistry: system.chemistry,
      inverterStandbyW: system.inverterStandbyW,
      inverterStandbyHoursPerDay: system.inverterStandbyHoursPerDay,
      inverterSurgeW: system.inverterSurgeW ?? undefined,
      bmsPeakA: system.bmsPeakA ?? undefined,
    },
  };
}

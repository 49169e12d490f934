import { Chemistry } from '@cellwarden/shared';
import { BmsConfig } from './battery-protection';
import { ChargeSourceConfig, ChargeSourceKind, Location } from './charge-sources';
import { LoadsConfig } from './house-loads';
import { OfflineSchedule } from './offline-schedule';
import { PackState, usableCapacityAt25 } from './pack-model';
import { ThermalConfig } from './thermal-model';

/** A named situation the simulator can play: a pack, its surroundings, its loads and sources. */
export interface Scenario {
  name: string;
  description: string;
  /** The pack at the start. */
  pack: PackState;
  location: Location;
  thermal: ThermalConfig;
  /** Living-space temperature at the start, °C (defaults to the pack's). */
  initialCabinTemperature?: number;
  loads: LoadsConfig;
  sources: readonly ChargeSourceConfig[];
  bms: BmsConfig;
  /** A monitor with a patchy connection drops off on this schedule unless the command line says otherwise. */
  offline?: OfflineSchedule;
}

/** What the server, the dashboard's demo and tests may know of a scenario without playing it. */
export interface ScenarioSummary {
  name: string;
  description: string;
  chemistry: Chemistry;
  nominalVoltage: 12 | 24 | 48;
  ratedCapacityAh: number;
  usableCapacityAh: number;
  chargeSources: { id: string; kind: ChargeSourceKind; ratedCurrent: number }[];
}

/** A scenario's metadata. */
export function summarizeScenario(scenario: Scenario): ScenarioSummary {
  return {
    name: scenario.name,
    description: scenario.description,
    chemistry: scenario.pack.chemistry,
    nominalVoltage: scenario.pack.nominalVoltage,
    ratedCapacityAh: scenario.pack.ratedCapacityAh,
    usableCapacityAh: usableCapacityAt25(scenario.pack),
    chargeSources: scenario.sources.map(({ id, kind, ratedCurrent }) => ({ id, kind, ratedCurrent })),
  };
}

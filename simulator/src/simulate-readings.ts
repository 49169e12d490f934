import { BatteryReading, CHEMISTRY_PROFILES } from '@cellwarden/shared';
import { mulberry32, Rng } from './mulberry32';
import { PackState, stepPack, terminalVoltage } from './pack-model';
import { Scenario } from './scenario';

/** How to play a scenario offline. */
export interface SimulationOptions {
  seed: number;
  /** Simulated start time, ms since the epoch. */
  start: number;
  intervalSeconds: number;
  count: number;
}

/** Readings as a device would report them, beside the true state of charge at each. */
export interface SimulationResult {
  readings: BatteryReading[];
  trueStateOfCharge: number[];
}

/** Ambient temperature at a time: a sine with its minimum at 04:00 UTC. */
export function ambientTemperature(scenario: Scenario, at: number): number {
  const hours = (at / 3_600_000) % 24;
  return scenario.ambientMean - scenario.ambientSwing * Math.cos(((hours - 4) / 24) * 2 * Math.PI);
}

/** Net pack current after the BMS decides whether charging is allowed. */
export function packCurrent(scenario: Scenario, pack: PackState): number {
  const tooCold = pack.temperature < CHEMISTRY_PROFILES[pack.chemistry].minimumChargeTemperature;
  const charge = tooCold && scenario.bmsBlocksColdCharge ? 0 : scenario.chargeCurrent;
  return charge - scenario.loadCurrent;
}

function stepScenario(scenario: Scenario, pack: PackState, at: number, dt: number): PackState {
  const ambient = ambientTemperature(scenario, at);
  const temperature = pack.temperature + ((ambient - pack.temperature) * dt) / scenario.thermalTimeConstant;
  return stepPack({ ...pack, temperature }, dt, packCurrent(scenario, pack));
}

function observe(pack: PackState, at: number, rng: Rng): BatteryReading {
  const noise = (scale: number) => (rng() - 0.5) * 2 * scale;
  const voltage = terminalVoltage(pack) + noise(0.01);
  const current = pack.current + noise(0.05);
  return {
    measuredAt: at,
    voltage,
    current,
    temperature: pack.temperature + noise(0.1),
    power: voltage * current,
  };
}

/** Plays a scenario without MQTT; the same seed gives the same readings. */
export function simulateReadings(scenario: Scenario, options: SimulationOptions): SimulationResult {
  const rng = mulberry32(options.seed);
  const readings: BatteryReading[] = [];
  const trueStateOfCharge: number[] = [];
  let pack = scenario.pack;
  for (let i = 0; i < options.count; i++) {
    const at = options.start + i * options.intervalSeconds * 1000;
    pack = stepScenario(scenario, pack, at, options.intervalSeconds);
    readings.push(observe(pack, at, rng));
    trueStateOfCharge.push(pack.stateOfCharge);
  }
  return { readings, trueStateOfCharge };
}

import { AirHeaterConfig, AirHeaterState, heaterWatts, stepAirHeater } from './air-heater';
import { FridgeConfig, FridgeState, fridgeWatts, stepFridge } from './compressor-fridge';
import { DailyWindow, withinWindows } from './local-time';
import { Rng } from './mulberry32';

/** An AC appliance on the inverter, on during its windows. */
export interface AcLoad {
  watts: number;
  schedule: readonly DailyWindow[];
}

/** An inverter: DC current = AC W / efficiency / voltage, plus its own idle draw while switched on. */
export interface InverterConfig {
  efficiency: number;
  idleWatts: number;
  schedule: readonly DailyWindow[];
  acLoads: readonly AcLoad[];
}

/** A small draw nobody switched on (standby electronics, a forgotten USB socket), wandering in a band, A. */
export interface StandbyDrainConfig {
  minCurrent: number;
  maxCurrent: number;
}

/** Every consumer of a system; absent ones are not fitted. */
export interface LoadsConfig {
  heater?: AirHeaterConfig;
  fridge?: FridgeConfig;
  lights?: { watts: number; schedule: readonly DailyWindow[] };
  inverter?: InverterConfig;
  drain?: StandbyDrainConfig;
}

/** The loads' changing state. */
export interface LoadsState {
  heater: AirHeaterState;
  fridge: FridgeState;
  drainCurrent: number;
}

/** What the loads need from their surroundings this step. */
export interface LoadsEnvironment {
  hour: number;
  cabinTemperature: number;
  busVoltage: number;
}

/** Starting state: heater off, fridge just starting, drain mid-band. */
export function initialLoadsState(config: LoadsConfig): LoadsState {
  const drain = config.drain;
  return {
    heater: { phase: 'off', phaseSeconds: 0 },
    fridge: { running: false, remainingSeconds: 0 },
    drainCurrent: drain ? (drain.minCurrent + drain.maxCurrent) / 2 : 0,
  };
}

/** DC power an inverter takes for its AC loads at the hour, W. */
export function inverterDcWatts(inverter: InverterConfig, hour: number): number {
  if (!withinWindows(inverter.schedule, hour)) return 0;
  const ac = inverter.acLoads
    .filter((load) => withinWindows(load.schedule, hour))
    .reduce((sum, load) => sum + load.watts, 0);
  return ac / inverter.efficiency + inverter.idleWatts;
}

function stepDrain(config: StandbyDrainConfig | undefined, current: number, dt: number, rng: Rng): number {
  if (!config) return 0;
  // A bounded random walk: slow enough to look like electronics waking and sleeping.
  const next = current + (rng() - 0.5) * 0.01 * Math.sqrt(dt);
  return Math.min(config.maxCurrent, Math.max(config.minCurrent, next));
}

/** Advances every load by dt; returns the new state, the DC current drawn (A, positive) and heater status. */
export function stepLoads(
  state: LoadsState,
  config: LoadsConfig,
  env: LoadsEnvironment,
  dtSeconds: number,
  rng: Rng,
): { state: LoadsState; current: number; heaterRunning: boolean } {
  const heater = config.heater
    ? stepAirHeater(state.heater, config.heater, env.cabinTemperature, env.hour, dtSeconds)
    : state.heater;
  const fridge = config.fridge
    ? stepFridge(state.fridge, config.fridge, env.cabinTemperature, dtSeconds, rng)
    : state.fridge;
  const drainCurrent = stepDrain(config.drain, state.drainCurrent, dtSeconds, rng);
  const lights = config.lights && withinWindows(config.lights.schedule, env.hour) ? config.lights.watts : 0;
  const watts =
    heaterWatts(heater) +
    (config.fridge ? fridgeWatts(fridge, config.fridge) : 0) +
    lights +
    (config.inverter ? inverterDcWatts(config.inverter, env.hour) : 0);
  return {
    state: { heater, fridge, drainCurrent },
    current: watts / env.busVoltage + drainCurrent,
    heaterRunning: heater.phase === 'run',
  };
}

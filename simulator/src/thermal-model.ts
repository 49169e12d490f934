import { localHour } from './local-time';

/** Outdoor temperature over a day: a sine between mean ± swing, coldest at `coldestHour` local time. */
export interface Climate {
  meanTemperature: number;
  dailySwing: number;
  coldestHour: number;
}

/** Where the pack sits and how quickly it and the living space follow their surroundings. */
export interface ThermalConfig {
  climate: Climate;
  /** Pack temperature time constant, s: heavy packs in a locker take hours. */
  packTimeConstantSeconds: number;
  /** Living-space time constant, s. */
  cabinTimeConstantSeconds: number;
  /** How far above ambient a running heater would hold the living space, K. */
  heaterRise: number;
  /** True when the pack sits in the heated living space, false for an outside locker. */
  packInCabin: boolean;
}

/** Temperatures that change slowly, °C. */
export interface ThermalState {
  cabinTemperature: number;
  packTemperature: number;
}

/** Ambient temperature at a time and longitude. */
export function ambientTemperature(climate: Climate, at: number, longitude: number): number {
  const phase = ((localHour(at, longitude) - climate.coldestHour) / 24) * 2 * Math.PI;
  return climate.meanTemperature - climate.dailySwing * Math.cos(phase);
}

// First-order lag solved exactly over dt, so any step size stays stable (Newton's law of cooling).
function follow(value: number, target: number, dtSeconds: number, timeConstant: number): number {
  return target + (value - target) * Math.exp(-dtSeconds / timeConstant);
}

/** Advances cabin and pack temperatures by dt with the heater running or not. */
export function stepThermal(
  state: ThermalState,
  config: ThermalConfig,
  ambient: number,
  heaterRunning: boolean,
  dtSeconds: number,
): ThermalState {
  const cabinTarget = ambient + (heaterRunning ? config.heaterRise : 0);
  const cabinTemperature = follow(
    state.cabinTemperature,
    cabinTarget,
    dtSeconds,
    config.cabinTimeConstantSeconds,
  );
  const surroundings = config.packInCabin ? state.cabinTemperature : ambient;
  const packTemperature = follow(
    state.packTemperature,
    surroundings,
    dtSeconds,
    config.packTimeConstantSeconds,
  );
  return { cabinTemperature, packTemperature };
}

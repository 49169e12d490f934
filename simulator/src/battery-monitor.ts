import { BatteryReading } from '@cellwarden/shared';
import { Rng } from './mulberry32';

/** A monitor's fixed calibration errors, drawn once per device from its seed. */
export interface SensorBias {
  voltage: number;
  current: number;
  temperature: number;
}

/** The monitor's own view: its calibration error and its coulomb-counted state of charge. */
export interface MonitorState {
  bias: SensorBias;
  /** State of charge the monitor believes, percent of the capacity it was told. */
  stateOfCharge: number;
  /** The capacity the owner entered, Ah (the pack's rating; the monitor knows nothing of cold or age). */
  capacityAh: number;
}

/** The true values a reading is taken from. */
export interface TrueValues {
  measuredAt: number;
  voltage: number;
  current: number;
  temperature: number;
  sourceCurrents: Record<string, number>;
}

const symmetric = (rng: Rng, scale: number) => (rng() - 0.5) * 2 * scale;
// Rounds to a number of decimals the way the monitor's display resolution does.
const round = (value: number, decimals: number) => Number(value.toFixed(decimals));

// Bias and noise sizes are typical of a hobby-grade shunt monitor (common practice): ±0.05 A offset, ±5 mV,
// ±0.3 °C.
/** Draws a monitor's calibration errors; the same generator state gives the same bias. */
export function drawSensorBias(rng: Rng, nominalVoltage: number): SensorBias {
  return {
    voltage: symmetric(rng, 0.005 * (nominalVoltage / 12)),
    current: symmetric(rng, 0.05),
    temperature: symmetric(rng, 0.3),
  };
}

/** Coulomb count over dt of what the monitor measures (true current + its bias); no efficiency, no Peukert. */
export function countCharge(monitor: MonitorState, trueCurrent: number, dtSeconds: number): MonitorState {
  const measured = trueCurrent + monitor.bias.current;
  const delta = ((measured * dtSeconds) / 3600 / monitor.capacityAh) * 100;
  return { ...monitor, stateOfCharge: Math.min(100, Math.max(0, monitor.stateOfCharge + delta)) };
}

/** One reading as the monitor reports it: true values plus bias and noise, rounded to its resolution. */
export function takeReading(truth: TrueValues, monitor: MonitorState, rng: Rng): BatteryReading {
  const voltage = round(truth.voltage + monitor.bias.voltage + symmetric(rng, 0.004), 3);
  const current = round(truth.current + monitor.bias.current + symmetric(rng, 0.03), 2);
  const sourceCurrents: Record<string, number> = {};
  for (const [id, amps] of Object.entries(truth.sourceCurrents)) {
    sourceCurrents[id] = amps > 0 ? round(Math.max(0, amps + symmetric(rng, 0.03)), 2) : 0;
  }
  return {
    measuredAt: truth.measuredAt,
    voltage,
    current,
    temperature: round(truth.temperature + monitor.bias.temperature + symmetric(rng, 0.1), 1),
    stateOfCharge: round(monitor.stateOfCharge, 1),
    power: round(voltage * current, 1),
    sourceCurrents,
  };
}

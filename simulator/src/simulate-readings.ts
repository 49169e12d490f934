import { BatteryReading } from '@cellwarden/shared';
import { countCharge, drawSensorBias, MonitorState, takeReading } from './battery-monitor';
import { mulberry32 } from './mulberry32';
import { Scenario } from './scenario';
import { initialSystemState, stepSystem, SystemFlows, SystemState } from './system-model';

/** How to play a scenario offline. */
export interface SimulationOptions {
  seed: number;
  /** Simulated start time, ms since the epoch: the first reading's measured time. */
  start: number;
  intervalSeconds: number;
  count: number;
  /**
   * Reads the same bank through a second monitor with its own calibration and noise, drawn from this seed: the
   * bank (and so its truth) is the one `seed` plays, the readings are another device's view of it.
   */
  monitorSeed?: number;
}

/** The true state behind one reading, for tests and for checking what the product should infer. */
export interface TrueSample extends SystemFlows {
  stateOfCharge: number;
  packTemperature: number;
  cabinTemperature: number;
}

/** Readings as a device would report them, beside the true state of charge and flows at each. */
export interface SimulationResult {
  readings: BatteryReading[];
  trueStateOfCharge: number[];
  truth: TrueSample[];
}

// Physics steps at most this long, s: short enough for a 90 s glow-plug surge and a charger's stage change.
const MAX_STEP_SECONDS = 10;

function truthOf(state: SystemState): TrueSample {
  return {
    ...state.flows,
    stateOfCharge: state.pack.stateOfCharge,
    packTemperature: state.pack.temperature,
    cabinTemperature: state.thermal.cabinTemperature,
  };
}

function sourceCurrents(state: SystemState): Record<string, number> {
  return Object.fromEntries(Object.entries(state.flows.sources).map(([id, flow]) => [id, flow.current]));
}

/** Plays a scenario forever, one reading per interval; the system runs one interval before the first reading. */
export function* playScenario(
  scenario: Scenario,
  options: Omit<SimulationOptions, 'count'>,
): Generator<{ reading: BatteryReading; truth: TrueSample }> {
  const rng = mulberry32(options.seed);
  const steps = Math.max(1, Math.ceil(options.intervalSeconds / MAX_STEP_SECONDS));
  const dt = options.intervalSeconds / steps;
  let state = initialSystemState(scenario, options.start - options.intervalSeconds * 1000, rng);
  const second =
    options.monitorSeed === undefined ? undefined : secondMonitor(options.monitorSeed, scenario, state);
  for (let i = 0; ; i++) {
    for (let s = 0; s < steps; s++) {
      state = stepSystem(scenario, state, dt, rng);
      if (second) second.monitor = countCharge(second.monitor, state.flows.packCurrent, dt);
    }
    const measuredAt = options.start + i * options.intervalSeconds * 1000;
    const values = {
      measuredAt,
      voltage: state.flows.busVoltage,
      current: state.flows.packCurrent,
      temperature: state.pack.temperature,
      sourceCurrents: sourceCurrents(state),
    };
    // The lead monitor's draws come from the bank's own generator, so they are taken even when a second
    // monitor reports: the bank then plays exactly as it does for the lead.
    const lead = takeReading(values, state.monitor, rng);
    const reading = second ? takeReading(values, second.monitor, second.rng) : lead;
    yield { reading, truth: truthOf(state) };
  }
}

function secondMonitor(seed: number, scenario: Scenario, state: SystemState) {
  const rng = mulberry32(seed);
  const monitor: MonitorState = {
    ...state.monitor,
    bias: drawSensorBias(rng, scenario.pack.nominalVoltage),
  };
  return { rng, monitor };
}

/** Plays `count` readings of a scenario without MQTT; the same seed gives the same readings. */
export function simulateReadings(scenario: Scenario, options: SimulationOptions): SimulationResult {
  const result: SimulationResult = { readings: [], trueStateOfCharge: [], truth: [] };
  if (options.count <= 0) return result;
  for (const { reading, truth } of playScenario(scenario, options)) {
    result.readings.push(reading);
    result.trueStateOfCharge.push(truth.stateOfCharge);
    result.truth.push(truth);
    if (result.readings.length >= options.count) break;
  }
  return result;
}

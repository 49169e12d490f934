import { BMS_CLEAR, BmsDecision, BmsState, decideBms } from './battery-protection';
import { countCharge, drawSensorBias, MonitorState } from './battery-monitor';
import { ChargeStage, ChargerState, chargerSettingsFor, RESTART, stepCharger } from './charge-controller';
import { availableCurrent } from './charge-sources';
import { initialLoadsState, LoadsState, stepLoads } from './house-loads';
import { localHour } from './local-time';
import { Rng } from './mulberry32';
import { PackState, stepPack, terminalVoltage } from './pack-model';
import { Scenario } from './scenario';
import { ambientTemperature, stepThermal, ThermalState } from './thermal-model';

/** What one charge source did in the last step. */
export interface SourceFlow {
  current: number;
  outputVoltage: number;
  stage: ChargeStage | 'off';
}

/** The currents and conditions of the last step: the truth a reading is taken from. */
export interface SystemFlows {
  ambientTemperature: number;
  busVoltage: number;
  packCurrent: number;
  loadCurrent: number;
  heaterRunning: boolean;
  coldChargeBlocked: boolean;
  dischargeCut: boolean;
  sources: Record<string, SourceFlow>;
}

/** Everything that changes in a simulated system. */
export interface SystemState {
  at: number;
  pack: PackState;
  thermal: ThermalState;
  loads: LoadsState;
  chargers: Record<string, ChargerState>;
  bms: BmsState;
  monitor: MonitorState;
  flows: SystemFlows;
}

/** The system at `start`, with the monitor's bias drawn from the generator. */
export function initialSystemState(scenario: Scenario, start: number, rng: Rng): SystemState {
  const { pack } = scenario;
  return {
    at: start,
    pack,
    thermal: {
      cabinTemperature: scenario.initialCabinTemperature ?? pack.temperature,
      packTemperature: pack.temperature,
    },
    loads: initialLoadsState(scenario.loads),
    chargers: {},
    bms: BMS_CLEAR,
    monitor: {
      bias: drawSensorBias(rng, pack.nominalVoltage),
      stateOfCharge: pack.stateOfCharge,
      capacityAh: pack.ratedCapacityAh,
    },
    flows: {
      ambientTemperature: ambientTemperature(scenario.thermal.climate, start, scenario.location.longitude),
      busVoltage: terminalVoltage(pack, 0),
      packCurrent: 0,
      loadCurrent: 0,
      heaterRunning: false,
      coldChargeBlocked: false,
      dischargeCut: false,
      sources: {},
    },
  };
}

function runChargers(scenario: Scenario, state: SystemState, hour: number, loadCurrent: number, dt: number) {
  const chargers: Record<string, ChargerState> = {};
  const sources: Record<string, SourceFlow> = {};
  let other = -loadCurrent;
  for (const source of scenario.sources) {
    const { busVoltage } = state.flows;
    const available = availableCurrent(source, scenario.location, state.at, hour, busVoltage);
    if (available <= 0) {
      chargers[source.id] = RESTART;
      sources[source.id] = { current: 0, outputVoltage: 0, stage: 'off' };
      continue;
    }
    const settings = chargerSettingsFor(state.pack, source.ratedCurrent, source.cableResistance);
    const previous = state.chargers[source.id] ?? RESTART;
    const out = stepCharger(previous, settings, state.pack, available, other, dt);
    chargers[source.id] = out.state;
    sources[source.id] = { current: out.current, outputVoltage: out.outputVoltage, stage: out.state.stage };
    other += out.current;
  }
  return { chargers, sources, total: other + loadCurrent };
}

// A blocked charge leaves the chargers feeding only the loads; a cut discharge leaves the loads only what
// the chargers give. Either way no current flows through the pack.
function applyBms(decision: BmsDecision, sources: Record<string, SourceFlow>, total: number, load: number) {
  const demand = total - load;
  if (demand > 0 && !decision.allowCharge) {
    const scale = total > 0 ? load / total : 0;
    for (const flow of Object.values(sources)) flow.current *= scale;
    return { packCurrent: 0, loadCurrent: load };
  }
  if (demand < 0 && !decision.allowDischarge) return { packCurrent: 0, loadCurrent: total };
  return { packCurrent: demand, loadCurrent: load };
}

/** Advances the whole system by dt seconds; `rng` drives the fridge's and the standby drain's wandering. */
export function stepSystem(scenario: Scenario, state: SystemState, dt: number, rng: Rng): SystemState {
  const { longitude } = scenario.location;
  const hour = localHour(state.at, longitude);
  const ambient = ambientTemperature(scenario.thermal.climate, state.at, longitude);
  const loadEnv = {
    hour,
    cabinTemperature: state.thermal.cabinTemperature,
    busVoltage: state.flows.busVoltage,
  };
  const loads = stepLoads(state.loads, scenario.loads, loadEnv, dt, rng);
  const charging = runChargers(scenario, state, hour, loads.current, dt);
  const decision = decideBms(state.bms, scenario.bms, state.pack, charging.total - loads.current, dt);
  const flow = applyBms(decision, charging.sources, charging.total, loads.current);
  const thermal = stepThermal(state.thermal, scenario.thermal, ambient, loads.heaterRunning, dt);
  const stepped = stepPack(state.pack, dt, flow.packCurrent);
  const pack = { ...stepped, temperature: thermal.packTemperature };
  return {
    at: state.at + dt * 1000,
    pack,
    thermal,
    loads: loads.state,
    chargers: charging.chargers,
    bms: decision.state,
    monitor: countCharge(state.monitor, flow.packCurrent, dt),
    flows: {
      ambientTemperature: ambient,
      busVoltage: terminalVoltage(stepped),
      packCurrent: flow.packCurrent,
      loadCurrent: flow.loadCurrent,
      heaterRunning: loads.heaterRunning,
      coldChargeBlocked: decision.coldChargeBlocked,
      dischargeCut: !decision.allowDischarge,
      sources: charging.sources,
    },
  };
}

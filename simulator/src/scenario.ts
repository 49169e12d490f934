import { PackState } from './pack-model';

/** A named situation the simulator can play: a pack, its surroundings, its loads and sources. */
export interface Scenario {
  name: string;
  pack: PackState;
  /** Mean ambient temperature and its day/night swing, °C; coldest at 04:00 local. */
  ambientMean: number;
  ambientSwing: number;
  /** Pack temperature time constant, seconds. */
  thermalTimeConstant: number;
  /** Steady house load, A (discharge). */
  loadCurrent: number;
  /** Charger output, A, while the charger runs. */
  chargeCurrent: number;
  /** False for a pack whose BMS lets a charger push current into it below its minimum charge temperature. */
  bmsBlocksColdCharge: boolean;
}

const basePack: PackState = {
  chemistry: 'lifepo4',
  nominalVoltage: 12,
  ratedCapacityAh: 200,
  stateOfCharge: 70,
  temperature: 5,
  current: 0,
};

/** The scenarios available by name. */
export const SCENARIOS: Readonly<Record<string, Scenario>> = {
  'frost-night': {
    name: 'frost-night',
    pack: basePack,
    ambientMean: -12,
    ambientSwing: 6,
    thermalTimeConstant: 3 * 3600,
    loadCurrent: 3,
    chargeCurrent: 20,
    bmsBlocksColdCharge: false,
  },
  'driving-day': {
    name: 'driving-day',
    pack: { ...basePack, temperature: 15, stateOfCharge: 40 },
    ambientMean: 15,
    ambientSwing: 5,
    thermalTimeConstant: 3 * 3600,
    loadCurrent: 4,
    chargeCurrent: 30,
    bmsBlocksColdCharge: true,
  },
};

import { copperPairResistance } from './charge-sources';
import { ALWAYS } from './local-time';
import { Scenario, ScenarioSummary, summarizeScenario } from './scenario';

// Every name, place and figure below is invented for demonstration. Load sizes are common practice values.

const evening = [{ from: 18, to: 23 }];
const vanFridge = { watts: 45, onMinutes: 12 };
const lockerThermal = { packTimeConstantSeconds: 3 * 3600, cabinTimeConstantSeconds: 1800, heaterRise: 45 };
const protectiveBms = {
  blocksColdCharge: true,
  continuousDischargeCurrent: 150,
  overCurrentResetSeconds: 60,
};

const frostNight: Scenario = {
  name: 'frost-night',
  description:
    'A van on a winter hook-up: −16 °C outside, the heater cycles, the pack in an outside locker cools below ' +
    '0 °C while the shore charger keeps charging it, because this BMS has no cold-charge cut-off.',
  pack: {
    chemistry: 'lifepo4',
    nominalVoltage: 12,
    ratedCapacityAh: 200,
    usableCapacityAh: 190,
    stateOfCharge: 45,
    temperature: 6,
    current: 0,
  },
  location: { latitude: 61.5, longitude: 23.8 },
  thermal: {
    ...lockerThermal,
    climate: { meanTemperature: -16, dailySwing: 4, coldestHour: 5 },
    packInCabin: false,
  },
  initialCabinTemperature: 16,
  loads: {
    heater: { schedule: ALWAYS, setpoint: 18, hysteresis: 1.5 },
    fridge: vanFridge,
    lights: { watts: 20, schedule: [{ from: 16, to: 23 }] },
  },
  sources: [
    {
      id: 'shore',
      kind: 'shore',
      ratedCurrent: 10,
      cableResistance: copperPairResistance(1.5, 6),
      schedule: ALWAYS,
    },
    {
      id: 'solar',
      kind: 'solar',
      ratedCurrent: 20,
      cableResistance: copperPairResistance(3, 6),
      array: { peakWatts: 200, derating: 0.8, clearness: 0.6 },
    },
  ],
  bms: { ...protectiveBms, blocksColdCharge: false },
};

const drivingDay: Scenario = {
  name: 'driving-day',
  description:
    'A summer touring day: the DC-DC charger runs while driving and takes a half-empty pack from bulk into ' +
    'absorption; roof solar helps, the fridge cycles, an inverter makes coffee and charges a laptop.',
  pack: {
    chemistry: 'lifepo4',
    nominalVoltage: 12,
    ratedCapacityAh: 100,
    stateOfCharge: 35,
    temperature: 15,
    current: 0,
  },
  location: { latitude: 46.8, longitude: 8.2 },
  thermal: {
    ...lockerThermal,
    climate: { meanTemperature: 18, dailySwing: 6, coldestHour: 5 },
    packInCabin: true,
  },
  loads: {
    fridge: vanFridge,
    lights: { watts: 15, schedule: [{ from: 20, to: 23 }] },
    inverter: {
      efficiency: 0.9,
      idleWatts: 10,
      schedule: [{ from: 7, to: 22 }],
      acLoads: [
        { watts: 900, schedule: [{ from: 7.5, to: 7.6 }] },
        { watts: 65, schedule: [{ from: 18, to: 21 }] },
      ],
    },
  },
  sources: [
    {
      id: 'dcdc',
      kind: 'dcdc',
      ratedCurrent: 30,
      cableResistance: copperPairResistance(4, 10),
      schedule: [
        { from: 9, to: 12 },
        { from: 13.5, to: 17 },
      ],
    },
    {
      id: 'solar',
      kind: 'solar',
      ratedCurrent: 20,
      cableResistance: copperPairResistance(3, 6),
      array: { peakWatts: 200, derating: 0.8, clearness: 0.9 },
    },
  ],
  bms: protectiveBms,
};

const commissioningPack = {
  chemistry: 'lifepo4',
  nominalVoltage: 12,
  ratedCapacityAh: 200,
  stateOfCharge: 60,
  temperature: 20,
  current: 0,
} as const;
const workshopThermal = {
  ...lockerThermal,
  climate: { meanTemperature: 20, dailySwing: 0, coldestHour: 5 },
  packInCabin: true,
};

/**
 * The workshop's engine runs for the first three quarters of every hour (local mean solar time), so an installer
 * who opens the DC-DC check at any time of day finds the charger in bulk within a quarter of an hour.
 */
export const ENGINE_RUNS = Array.from({ length: 24 }, (_, hour) => ({ from: hour, to: hour + 0.75 }));

/** A resistive load bank on the inverter, sized so the pack gains about what it loses each hour. */
const loadBank = (acWatts: number) => ({
  inverter: {
    efficiency: 0.9,
    idleWatts: 10,
    schedule: ALWAYS,
    acLoads: [{ watts: acWatts, schedule: ALWAYS }],
  },
});

const chargerCommissioning: Scenario = {
  name: 'charger-commissioning',
  description:
    'A workshop test of a new install: the engine runs 45 minutes of every hour, the 60 A DC-DC charger on ' +
    '25 mm² cable holds its rated output in bulk while a load bank keeps the pack from filling.',
  pack: commissioningPack,
  location: { latitude: 52.1, longitude: 5.1 },
  thermal: workshopThermal,
  // 60 A for 45 min against ~45 A all hour: the pack loses about 1 % a day and stays in bulk for days.
  loads: loadBank(520),
  sources: [
    {
      id: 'dcdc',
      kind: 'dcdc',
      ratedCurrent: 60,
      cableResistance: copperPairResistance(3, 25),
      schedule: ENGINE_RUNS,
    },
  ],
  bms: protectiveBms,
};

const thinCable: Scenario = {
  ...chargerCommissioning,
  name: 'thin-cable',
  description:
    'The same 60 A DC-DC charger wired with 2.5 mm² cable: the cable drops over a volt, the charger reaches ' +
    'its absorption voltage at its own terminals early and the battery gets far less than the rating.',
  // The thin cable lets through roughly half the rating, so its load bank is smaller.
  loads: loadBank(200),
  sources: [
    {
      id: 'dcdc',
      kind: 'dcdc',
      ratedCurrent: 60,
      cableResistance: copperPairResistance(3, 2.5),
      schedule: ENGINE_RUNS,
    },
  ],
};

const phantomDrain: Scenario = {
  name: 'phantom-drain',
  description:
    'A parked boat with everything switched off: standby electronics still draw 0.3–0.8 A and the AGM bank ' +
    'slowly empties.',
  pack: {
    chemistry: 'agm',
    nominalVoltage: 12,
    ratedCapacityAh: 110,
    usableCapacityAh: 105,
    stateOfCharge: 95,
    temperature: 12,
    current: 0,
  },
  location: { latitude: 54.3, longitude: 10.1 },
  thermal: {
    ...lockerThermal,
    climate: { meanTemperature: 12, dailySwing: 3, coldestHour: 5 },
    packInCabin: false,
  },
  loads: { drain: { minCurrent: 0.3, maxCurrent: 0.8 } },
  sources: [],
  bms: { blocksColdCharge: true, continuousDischargeCurrent: 200, overCurrentResetSeconds: 60 },
  // The marina's mobile coverage comes and goes: the monitor buffers and catches up.
  offline: { everyMinutes: 120, forMinutes: 20 },
};

const flatByMorning: Scenario = {
  name: 'flat-by-morning',
  description:
    'A 24 V cabin bank left nearly empty: evening inverter loads pull it down until the BMS cuts discharge at ' +
    'its low-voltage limit; the voltage recovers and nothing flows until a charger returns.',
  pack: {
    chemistry: 'lifepo4',
    nominalVoltage: 24,
    ratedCapacityAh: 100,
    stateOfCharge: 12,
    temperature: 21,
    current: 0,
  },
  location: { latitude: 60.4, longitude: 11.0 },
  thermal: {
    ...lockerThermal,
    climate: { meanTemperature: 19, dailySwing: 3, coldestHour: 5 },
    packInCabin: true,
  },
  initialCabinTemperature: 21,
  loads: {
    fridge: { watts: 60, onMinutes: 15 },
    lights: { watts: 40, schedule: evening },
    inverter: {
      efficiency: 0.9,
      idleWatts: 15,
      schedule: ALWAYS,
      acLoads: [{ watts: 400, schedule: evening }],
    },
  },
  sources: [],
  bms: protectiveBms,
};

/** The scenarios available by name. */
export const SCENARIOS: Readonly<Record<string, Scenario>> = Object.fromEntries(
  [frostNight, drivingDay, chargerCommissioning, thinCable, phantomDrain, flatByMorning].map((s) => [
    s.name,
    s,
  ]),
);

/** Scenario names, in the order `--fleet` deals them out. */
export const SCENARIO_NAMES: readonly string[] = Object.keys(SCENARIOS);

/** Metadata of every scenario, for the server and tests (e.g. the commissioning charger's rating). */
export const SCENARIO_SUMMARIES: readonly ScenarioSummary[] = SCENARIO_NAMES.map((name) =>
  summarizeScenario(SCENARIOS[name]),
);

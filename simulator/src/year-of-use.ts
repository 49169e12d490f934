// A year (or any number of days) of one battery's life, minute by minute, fast enough to seed a demo database
// and to test the capacity estimator against a known truth: the pack model's physics with 60 s steps, the
// owner's rhythm from year-of-use-plan, a BMS, a monitor with its own calibration errors, and capacity fade.
// A generator: one minute at a time, so a year never sits in memory.
import { Chemistry, MinuteSummary } from '@cellwarden/shared';
import { BMS_CLEAR, BmsState, decideBms } from './battery-protection';
import { drawSensorBias, SensorBias } from './battery-monitor';
import { chargerSettingsFor, ChargerState, RESTART, stepCharger } from './charge-controller';
import { localHour } from './local-time';
import { mulberry32, Rng } from './mulberry32';
import { AgeingState, NEW_PACK, remainingCapacityFraction, stepAgeing } from './pack-ageing';
import { PackState, stepPack, terminalVoltage } from './pack-model';
import {
  airTemperature,
  coldChargingDays,
  DayPlan,
  dayOfYear,
  drawRestTarget,
  planDay,
  solarCurrent,
  summerness,
  TEMPERATE_CLIMATE,
  UsagePattern,
  WEEKLY_FULL_CHARGE,
  YearClimate,
} from './year-of-use-plan';

/** The simulated bank. */
export interface YearPack {
  chemistry: Chemistry;
  nominalVoltage: 12 | 24 | 48;
  ratedCapacityAh: number;
  /** What the new pack really holds at 25 °C, Ah (LiFePO4 packs often ship a little above their rating). */
  newCapacityAh?: number;
}

/** What to generate. */
export interface YearOfUseOptions {
  seed: number;
  /** First minute, ms (rounded down to a whole minute). */
  start: number;
  /** Days to generate (365 for the demo year). */
  days: number;
  pack?: YearPack;
  climate?: YearClimate;
  usage?: UsagePattern;
  /** Longitude of the system, degrees east: local clock hours follow it. */
  longitude?: number;
  /** Day indices of the cold-charging nights; default: two nights around the coldest day in the period. */
  coldChargingDays?: readonly number[];
  /** False to keep the pack new (to isolate the estimator from fade). */
  ageing?: boolean;
  /** The monitor's calibration errors; by default drawn, with the current offset of a monitor zeroed at installation. */
  sensorBias?: Partial<SensorBias>;
}

/** The truth behind one minute. */
export interface MinuteTruth {
  /** Whole capacity at 25 °C the pack holds now, Ah. */
  capacityAh: number;
  /** True state of charge, percent of that capacity. */
  stateOfCharge: number;
  packTemperature: number;
  /** True pack current, A (+ = charging). */
  current: number;
  fade: AgeingState;
}

/** One generated minute: the rollup the product would store, and the truth behind it. */
export interface SimulatedMinute {
  minute: MinuteSummary;
  truth: MinuteTruth;
}

/** The demo system's bank: 200 Ah LiFePO4 at 12 V that holds 204 Ah new. */
export const DEMO_PACK: YearPack = {
  chemistry: 'lifepo4',
  nominalVoltage: 12,
  ratedCapacityAh: 200,
  newCapacityAh: 204,
};

const MINUTE_MS = 60_000;
const DAY_MS = 86_400_000;
const STEP_SECONDS = 60;
// A battery in an outside locker: a few degrees above the air, following it over about three hours.
const LOCKER_RISE_C = 3;
const PACK_TIME_CONSTANT_S = 3 * 3600;
const BMS = { continuousDischargeCurrent: 200, overCurrentResetSeconds: 60 };
// Many LiFePO4 BMSs stop charge a few degrees above freezing, a margin for their own sensor's error
// (common practice, from memory); only the two cold-charging nights get past it.
const COLD_LOCK_C = 3;
// A monitor zeroed at installation keeps about a fifth of a hobby-grade shunt's ±0.05 A offset (from memory).
const ZEROED_OFFSET_SHARE = 0.2;

interface YearState {
  pack: PackState;
  ageing: AgeingState;
  charger: ChargerState;
  chargerCurrent: number;
  bms: BmsState;
  monitorSoc: number;
  plan?: DayPlan;
  restTarget: number;
  offUntil: number;
}

/** Generates the minutes of `options.days` days, each with its truth; the same seed gives the same year. */
export function* yearOfUse(options: YearOfUseOptions): Generator<SimulatedMinute> {
  const pack = options.pack ?? DEMO_PACK;
  const newCapacityAh = pack.newCapacityAh ?? pack.ratedCapacityAh;
  const climate = options.climate ?? TEMPERATE_CLIMATE;
  const usage = options.usage ?? WEEKLY_FULL_CHARGE;
  const longitude = options.longitude ?? 10;
  const start = Math.floor(options.start / MINUTE_MS) * MINUTE_MS;
  const firstLocalDay = localDay(start, longitude);
  // Day indices count local days, so the cold nights are found on the local calendar.
  const coldDays =
    options.coldChargingDays ?? coldChargingDays(firstLocalDay * DAY_MS, options.days, climate);
  const rng = mulberry32(options.seed);
  const drawn = drawSensorBias(rng, pack.nominalVoltage);
  const bias = { ...drawn, current: drawn.current * ZEROED_OFFSET_SHARE, ...options.sensorBias };
  let state = initialState(pack, newCapacityAh, airTemperatureGuess(start, climate));
  for (let i = 0; i < options.days * 1440; i++) {
    const at = start + i * MINUTE_MS;
    const dayIndex = localDay(at, longitude) - firstLocalDay;
    if (state.plan?.dayIndex !== dayIndex) {
      const restTarget =
        dayIndex % usage.fullChargeEveryDays === 0 || state.plan === undefined
          ? drawRestTarget(usage, rng)
          : state.restTarget;
      const plan = planDay({ dayIndex, dayStart: at, climate, usage, coldDays, restTarget }, rng);
      state = { ...state, plan, restTarget };
    }
    state = stepMinute(state, { at, hour: localHour(at, longitude), climate, usage, newCapacityAh }, options);
    const minute = summarize(state, at, bias, rng);
    state = { ...state, monitorSoc: minute.socLast ?? state.monitorSoc };
    yield { minute, truth: truthOf(state) };
  }
}

function localDay(at: number, longitude: number): number {
  return Math.floor((at + (longitude / 15) * 3_600_000) / DAY_MS);
}

function airTemperatureGuess(at: number, climate: YearClimate): number {
  return climate.meanTemperature + climate.seasonalSwing * (2 * summerness(dayOfYear(at), climate) - 1);
}

function initialState(pack: YearPack, newCapacityAh: number, temperature: number): YearState {
  return {
    pack: { ...pack, usableCapacityAh: newCapacityAh, stateOfCharge: 100, temperature, current: 0 },
    ageing: NEW_PACK,
    charger: { stage: 'float', stageSeconds: 0 },
    chargerCurrent: 0,
    bms: BMS_CLEAR,
    monitorSoc: 100,
    restTarget: 0.5,
    offUntil: 0,
  };
}

interface MinuteContext {
  at: number;
  hour: number;
  climate: YearClimate;
  usage: UsagePattern;
  newCapacityAh: number;
}

function stepMinute(state: YearState, c: MinuteContext, options: YearOfUseOptions): YearState {
  const plan = state.plan as DayPlan;
  const offUntil =
    plan.switchOffHour !== undefined && c.hour >= plan.switchOffHour && state.offUntil <= c.at
      ? c.at + (24 - c.hour + 8) * 3_600_000
      : state.offUntil;
  const switchedOff = c.at < offUntil;
  const air = airTemperature(plan, c.climate, c.hour);
  const temperature = follow(state.pack.temperature, air + LOCKER_RISE_C);
  const pack = { ...state.pack, temperature };
  const base = switchedOff ? 0 : houseLoad(c.hour, plan.summer, air);
  const load = switchedOff ? 0 : base + steeredLoad(state, plan, c.hour, base);
  const available = switchedOff ? 0 : chargeAvailable(plan, c.usage, c.hour);
  const charge = runCharger(state.charger, pack, available, load, c.usage);
  const demand = charge.current - load;
  const bmsConfig = { ...BMS, blocksColdCharge: false };
  const decision = decideBms(state.bms, bmsConfig, pack, demand, STEP_SECONDS);
  // The lock is off only for the cold night's shore charge (until 08:00), not for the sun later that day.
  const coldNight = plan.coldChargingAllowed && c.hour < 8;
  const coldLocked = pack.chemistry === 'lifepo4' && temperature < COLD_LOCK_C && !coldNight;
  const tripping = !state.bms.lowVoltageCut && decision.state.lowVoltageCut;
  // The minute in which the BMS trips still shows the sag that tripped it; from the next one nothing flows.
  let current = demand;
  if (demand > 0 && (!decision.allowCharge || coldLocked)) current = 0;
  if (demand < 0 && !decision.allowDischarge && !tripping) current = 0;
  const stepped = stepPack(pack, STEP_SECONDS, current);
  const ageing =
    options.ageing === false
      ? state.ageing
      : stepAgeing(state.ageing, pack.chemistry, c.newCapacityAh, { current, temperature }, STEP_SECONDS);
  const usableCapacityAh = c.newCapacityAh * remainingCapacityFraction(ageing);
  const finished = state.charger.stage === 'absorption' && charge.state.stage === 'float';
  return {
    ...state,
    pack: { ...stepped, usableCapacityAh },
    ageing,
    charger: charge.state,
    // What the sources really delivered: all of it, or only what the loads took when the BMS blocked charge.
    chargerCurrent: Math.min(charge.current, current + load),
    bms: decision.state,
    monitorSoc: finished ? 100 : state.monitorSoc,
    offUntil,
  };
}

function follow(value: number, target: number): number {
  return target + (value - target) * Math.exp(-STEP_SECONDS / PACK_TIME_CONSTANT_S);
}

/** The loads of an occupied van or cabin, A: standby, a cycling fridge, evening lights, heater on cold nights. */
function houseLoad(hour: number, summer: number, air: number): number {
  const fridgeDuty = 0.25 + 0.3 * summer;
  const fridgeOn = ((hour * 60) % 40) / 40 < fridgeDuty;
  const lights = hour >= 18 && hour < 23 ? 3 : 0;
  const heater = air < 5 && (hour >= 20 || hour < 8) ? 1.5 : 0;
  const coffee = hour >= 7.5 && hour < 7.55 ? 70 : 0;
  return 0.3 + (fridgeOn ? 4.5 : 0) + lights + heater + coffee;
}

/**
 * The owner's other use (inverter, pump, tools), steered so the bank reaches the plan's state of charge by the
 * plan's hour: every season then gives deep discharges, which is what the estimator needs to be tested on.
 */
function steeredLoad(state: YearState, plan: DayPlan, hour: number, base: number): number {
  if (plan.targetStateOfCharge === undefined || hour >= plan.targetHour) return 0;
  const capacity = state.pack.usableCapacityAh ?? state.pack.ratedCapacityAh;
  const needAh = (state.pack.stateOfCharge / 100 - plan.targetStateOfCharge) * capacity;
  const wanted = -needAh / (plan.targetHour - hour);
  return Math.min(80, Math.max(0, state.chargerCurrent - base - wanted));
}

function chargeAvailable(plan: DayPlan, usage: UsagePattern, hour: number): number {
  const shore = plan.shore.some((w) => hour >= w.from && hour < w.to) ? usage.shoreChargerCurrent : 0;
  return shore + solarCurrent(plan, usage, hour);
}

function runCharger(
  previous: ChargerState,
  pack: PackState,
  available: number,
  load: number,
  usage: UsagePattern,
): { state: ChargerState; current: number } {
  if (available <= 0) return { state: RESTART, current: 0 };
  const rating = usage.shoreChargerCurrent + usage.solarPeakCurrent;
  const settings = chargerSettingsFor(pack, rating, 0.005);
  const out = stepCharger(previous, settings, pack, available, -load, STEP_SECONDS);
  return { state: out.state, current: out.current };
}

/** The minute as the monitor measures it: calibration bias and noise on current, voltage and temperature. */
function summarize(state: YearState, at: number, bias: SensorBias, rng: Rng): MinuteSummary {
  const { pack } = state;
  const blocks = pack.nominalVoltage / 12;
  const current = pack.current + bias.current + (rng() - 0.5) * 0.06;
  const voltage = terminalVoltage(pack) + bias.voltage + (rng() - 0.5) * 0.008 * blocks;
  const ahIn = Math.max(0, current) / 60;
  const ahOut = Math.max(0, -current) / 60;
  // The monitor counts what it measures against the rating, and resets to 100 % when the charger finishes.
  const socLast = clamp(state.monitorSoc + (current / 60 / pack.ratedCapacityAh) * 100, 0, 100);
  return {
    start: at,
    voltageMin: voltage - 0.002 * blocks,
    voltageMax: voltage + 0.002 * blocks,
    voltageLast: voltage,
    currentMin: current - 0.02,
    currentMax: current + 0.02,
    currentMean: current,
    temperatureMean: pack.temperature + bias.temperature,
    ahIn,
    ahOut,
    whIn: ahIn * voltage,
    whOut: ahOut * voltage,
    socLast,
  };
}

function truthOf(state: YearState): MinuteTruth {
  const { pack } = state;
  return {
    capacityAh: pack.usableCapacityAh ?? pack.ratedCapacityAh,
    stateOfCharge: pack.stateOfCharge,
    packTemperature: pack.temperature,
    current: pack.current,
    fade: state.ageing,
  };
}

function clamp(value: number, low: number, high: number): number {
  return Math.min(high, Math.max(low, value));
}

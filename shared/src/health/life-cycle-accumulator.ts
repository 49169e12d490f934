// Life-cycle figures built hour by hour from the hourly rollups, never by rescanning history: every figure is
// a running sum or a short list, and the whole state is plain JSON the server persists and resumes from.
import { AnalyticsSettingError } from '../analytics/analytics-error';
import {
  ChargeEpisode,
  HourSummary,
  LifeCycleFigures,
  LifeCycleState,
  TemperatureBand,
} from './health-types';
import { CountedRange, pushRainflowPoint, residueRanges } from './rainflow-count';

/** A life-cycle accumulator for one battery. */
export interface LifeCycleAccumulator {
  /** Takes one hour (in order; an hour not after the last one, or without readings, is ignored). */
  push(hour: HourSummary): void;
  /** The figures so far. */
  figures(): LifeCycleFigures;
  /** The JSON state to persist and resume from. */
  state(): LifeCycleState;
}

// Thresholds (°C, %). LiFePO4 cell makers commonly allow charging between 0 and 45 °C, and cells age fastest
// kept full and hot (manufacturers' datasheets and storage advice, from memory; common practice).
/** An hour whose lowest temperature is below this and that took charge is cold charging, °C. */
export const COLD_CHARGE_BELOW_C = 0;
/** An hour whose highest temperature is above this and that took charge is hot charging, °C. */
export const HOT_CHARGE_ABOVE_C = 45;
/** "Hot at high charge": mean temperature at or above this, °C … */
export const HOT_STORAGE_FROM_C = 35;
/** … with the state of charge at or above this, %. */
export const HIGH_CHARGE_FROM_PERCENT = 90;
/** An hour at or above this state of charge counts as full for the round-trip efficiency, %. */
export const FULL_FROM_PERCENT = 99;
/**
 * Charge below this share of the usable capacity in an hour is not an episode: a shunt's zero offset alone
 * puts a few hundredths of an amp-hour into every hour (common practice).
 */
export const EPISODE_MIN_CHARGE_SHARE = 0.002;
/** Width of the depth-of-discharge bands, %. */
export const DEPTH_BAND_PERCENT = 10;

const HOUR_MS = 3_600_000;
const BANDS: readonly TemperatureBand[] = ['below-0', '0-10', '10-35', '35-45', 'above-45'];

/** Creates an accumulator for a battery of `usableAh`, resuming from `state` when given. */
export function createLifeCycleAccumulator(usableAh: number, state?: LifeCycleState): LifeCycleAccumulator {
  if (!Number.isFinite(usableAh) || usableAh <= 0) {
    throw new AnalyticsSettingError(
      'bad_battery_setup',
      'usableAh',
      `usableAh must be a positive number of Ah; got ${usableAh}`,
    );
  }
  const current: LifeCycleState = state?.version === 1 ? copyState(state) : emptyState(usableAh);
  current.usableAh = usableAh;
  return {
    push(hour) {
      if (isCountable(hour, current)) addHour(current, hour);
    },
    figures: () => figuresOf(current),
    state: () => copyState(current),
  };
}

function emptyState(usableAh: number): LifeCycleState {
  return {
    version: 1,
    usableAh,
    hoursCovered: 0,
    ahIn: 0,
    ahOut: 0,
    whIn: 0,
    whOut: 0,
    wholeCycleWhIn: 0,
    wholeCycleWhOut: 0,
    pendingWhIn: 0,
    pendingWhOut: 0,
    seenFull: false,
    reversals: [],
    closedCycles: new Array<number>(100 / DEPTH_BAND_PERCENT).fill(0),
    temperatureHours: { 'below-0': 0, '0-10': 0, '10-35': 0, '35-45': 0, 'above-45': 0 },
    hotAtHighChargeHours: 0,
    coldCharging: [],
    hotCharging: [],
  };
}

function copyState(state: LifeCycleState): LifeCycleState {
  return JSON.parse(JSON.stringify(state)) as LifeCycleState;
}

function isCountable(hour: HourSummary, state: LifeCycleState): boolean {
  const required = [hour.start, hour.ahIn, hour.ahOut, hour.whIn, hour.whOut, hour.temperatureMean];
  const limits = [hour.temperatureMin, hour.temperatureMax];
  return (
    required.every(Number.isFinite) &&
    limits.every(Number.isFinite) &&
    hour.readingCount > 0 &&
    hour.ahIn >= 0 &&
    hour.ahOut >= 0 &&
    (state.lastHourStart === undefined || hour.start > state.lastHourStart)
  );
}

function addHour(state: LifeCycleState, hour: HourSummary): void {
  state.lastHourStart = hour.start;
  state.hoursCovered += 1;
  state.ahIn += hour.ahIn;
  state.ahOut += hour.ahOut;
  state.whIn += hour.whIn;
  state.whOut += hour.whOut;
  addEnergyBetweenFulls(state, hour);
  // Depth of discharge follows the hourly last state of charge: swings inside one hour are not seen.
  const soc = hour.socLast;
  if (soc !== undefined && Number.isFinite(soc)) {
    for (const counted of pushRainflowPoint(state.reversals, soc)) addCycles(state.closedCycles, counted);
  }
  // The band comes from the hour's mean: an hour that swung across a boundary counts in one band only.
  state.temperatureHours[bandOf(hour.temperatureMean)] += 1;
  const highCharge = hour.socMax ?? hour.socLast;
  if (highCharge !== undefined && highCharge >= HIGH_CHARGE_FROM_PERCENT) {
    if (hour.temperatureMean >= HOT_STORAGE_FROM_C) state.hotAtHighChargeHours += 1;
  }
  const charged = hour.ahIn >= EPISODE_MIN_CHARGE_SHARE * state.usableAh;
  if (charged && hour.temperatureMin < COLD_CHARGE_BELOW_C) addToEpisodes(state.coldCharging, hour);
  if (charged && hour.temperatureMax > HOT_CHARGE_ABOVE_C) addToEpisodes(state.hotCharging, hour);
}

/**
 * Round-trip efficiency needs the same stored energy at both ends: energy is summed from the first full hour
 * and moved into the "whole cycles" sums at each later full hour, so only full-to-full stretches count.
 */
function addEnergyBetweenFulls(state: LifeCycleState, hour: HourSummary): void {
  const full = (hour.socMax ?? hour.socLast ?? 0) >= FULL_FROM_PERCENT;
  if (state.seenFull) {
    state.pendingWhIn += hour.whIn;
    state.pendingWhOut += hour.whOut;
  }
  if (!full) return;
  state.wholeCycleWhIn += state.pendingWhIn;
  state.wholeCycleWhOut += state.pendingWhOut;
  state.pendingWhIn = 0;
  state.pendingWhOut = 0;
  state.seenFull = true;
}

function addCycles(closedCycles: number[], counted: CountedRange): void {
  if (counted.range <= 0) return;
  closedCycles[depthBand(counted.range)] += counted.cycles;
}

function depthBand(range: number): number {
  const bands = 100 / DEPTH_BAND_PERCENT;
  return Math.min(bands - 1, Math.floor(range / DEPTH_BAND_PERCENT));
}

function bandOf(temperature: number): TemperatureBand {
  if (temperature < 0) return 'below-0';
  if (temperature < 10) return '0-10';
  if (temperature < 35) return '10-35';
  if (temperature <= 45) return '35-45';
  return 'above-45';
}

/** Consecutive hours join the last episode; a gap of an hour or more starts a new one. */
function addToEpisodes(episodes: ChargeEpisode[], hour: HourSummary): void {
  const last = episodes[episodes.length - 1];
  if (last !== undefined && last.end === hour.start) {
    last.end = hour.start + HOUR_MS;
    last.ahIn += hour.ahIn;
    last.lowestTemperature = Math.min(last.lowestTemperature, hour.temperatureMin);
    last.highestTemperature = Math.max(last.highestTemperature, hour.temperatureMax);
    return;
  }
  episodes.push({
    start: hour.start,
    end: hour.start + HOUR_MS,
    ahIn: hour.ahIn,
    lowestTemperature: hour.temperatureMin,
    highestTemperature: hour.temperatureMax,
  });
}

function figuresOf(state: LifeCycleState): LifeCycleFigures {
  const cycles = [...state.closedCycles];
  for (const counted of residueRanges(state.reversals)) addCycles(cycles, counted);
  return {
    equivalentFullCycles: state.ahOut / state.usableAh,
    ahIn: state.ahIn,
    ahOut: state.ahOut,
    whIn: state.whIn,
    whOut: state.whOut,
    ...(state.wholeCycleWhIn > 0 ? { chargeEfficiency: state.wholeCycleWhOut / state.wholeCycleWhIn } : {}),
    depthOfDischarge: cycles.map((count, i) => ({
      fromPercent: i * DEPTH_BAND_PERCENT,
      toPercent: (i + 1) * DEPTH_BAND_PERCENT,
      cycles: count,
    })),
    temperatureHours: BANDS.map((band) => ({ band, hours: state.temperatureHours[band] })),
    hotAtHighChargeHours: state.hotAtHighChargeHours,
    coldCharging: state.coldCharging.map((e) => ({ ...e })),
    hotCharging: state.hotCharging.map((e) => ({ ...e })),
    hoursCovered: state.hoursCovered,
  };
}

// The owner's year behind the year-of-use generator: seasons and weather, the weekly rhythm of a full charge
// on shore power, a run down to a drawn depth, a night with everything switched off, and two winter nights on
// shore power with the BMS's cold-charge lock off. All values are invented for demonstration; load sizes are
// common practice values.
import { Rng } from './mulberry32';

/** Seasonal and daily air temperature where the system lives. */
export interface YearClimate {
  /** Mean over the year, °C. */
  meanTemperature: number;
  /** Half the difference between the warmest and coldest day means, °C. */
  seasonalSwing: number;
  /** Half the difference between afternoon and pre-dawn, °C. */
  dailySwing: number;
  /** Day of the year (1–365) of the coldest mean. */
  coldestDayOfYear: number;
}

/** How the owner uses the system. */
export interface UsagePattern {
  /** Days between full charges on shore power (the charge day starts each period). */
  fullChargeEveryDays: number;
  /** State of charge the owner runs the bank down to before switching off for a night, fraction [from, to]; below 0 means until the BMS cuts. */
  restStateOfCharge: readonly [number, number];
  /** Peak solar charge current on a clear summer day, A. */
  solarPeakCurrent: number;
  /** Shore charger rating, A. */
  shoreChargerCurrent: number;
}

/** What the owner does on one local day. */
export interface DayPlan {
  dayIndex: number;
  /** 0 (overcast) to 1 (clear). */
  clearness: number;
  /** Mean air temperature of the day, °C (weather shifts it from the season's). */
  meanTemperature: number;
  /** Seasonal weight of the day, 0 (coldest) to 1 (warmest). */
  summer: number;
  /** Shore power windows, local hours. */
  shore: readonly { from: number; to: number }[];
  /** State of charge (fraction) the owner steers toward by `targetHour` (local), or none on a charge day. */
  targetStateOfCharge?: number;
  targetHour: number;
  /** Local hour from which everything is switched off until 08:00 next morning. */
  switchOffHour?: number;
  /** The BMS's cold-charge lock is off this day (and the shore charger runs through the night). */
  coldChargingAllowed: boolean;
}

/** Default climate: a cool-temperate coast with frosty January nights. */
export const TEMPERATE_CLIMATE: YearClimate = {
  meanTemperature: 9,
  seasonalSwing: 12,
  dailySwing: 4,
  coldestDayOfYear: 20,
};

/** Default use: a full charge every week, run down to 5–25 % (now and then to the BMS cut-off) before a night away. */
export const WEEKLY_FULL_CHARGE: UsagePattern = {
  fullChargeEveryDays: 7,
  restStateOfCharge: [-0.03, 0.25],
  solarPeakCurrent: 15,
  shoreChargerCurrent: 40,
};

const DAY_MS = 86_400_000;

/** Day of the year (1–366) of an instant, UTC. */
export function dayOfYear(at: number): number {
  const date = new Date(at);
  return Math.floor((at - Date.UTC(date.getUTCFullYear(), 0, 1)) / DAY_MS) + 1;
}

/** Air temperature at a local hour of a day: the day's mean plus a daily swing warmest at 15:00. */
export function airTemperature(plan: DayPlan, climate: YearClimate, hour: number): number {
  return plan.meanTemperature + climate.dailySwing * Math.cos((2 * Math.PI * (hour - 15)) / 24);
}

/** Seasonal weight, 0 at the coldest day to 1 half a year later. */
export function summerness(day: number, climate: YearClimate): number {
  return (1 - Math.cos((2 * Math.PI * (day - climate.coldestDayOfYear)) / 365.25)) / 2;
}

/** Solar current available at a local hour: day length and height follow the season, clearness the weather. */
export function solarCurrent(plan: DayPlan, usage: UsagePattern, hour: number): number {
  const { summer } = plan;
  const dayLength = 8 + 8 * summer;
  const sunrise = 12.5 - dayLength / 2;
  const phase = (hour - sunrise) / dayLength;
  if (phase <= 0 || phase >= 1) return 0;
  return usage.solarPeakCurrent * (0.3 + 0.7 * summer) * plan.clearness * Math.sin(Math.PI * phase);
}

/** Where the plan of one day comes from. */
export interface DayContext {
  dayIndex: number;
  /** The day's first instant, ms. */
  dayStart: number;
  climate: YearClimate;
  usage: UsagePattern;
  /** Day indices with cold charging. */
  coldDays: readonly number[];
  /** State of charge (fraction) drawn for this period's night away. */
  restTarget: number;
}

/** The owner's plan for one day; `rng` draws its weather. */
export function planDay(context: DayContext, rng: Rng): DayPlan {
  const { dayIndex, dayStart, climate, usage, coldDays, restTarget } = context;
  const summer = summerness(dayOfYear(dayStart), climate);
  // The cold-charging night and the day before it are a cold snap, so the pack is below freezing then.
  const coldSnap = coldDays.includes(dayIndex) || coldDays.includes(dayIndex + 1);
  const weather = coldSnap ? -4 - 3 * rng() : (rng() - 0.5) * 6;
  const clearness = 0.2 + 0.8 * rng();
  const meanTemperature = climate.meanTemperature + climate.seasonalSwing * (2 * summer - 1) + weather;
  const coldChargingAllowed = coldDays.includes(dayIndex);
  const period = usage.fullChargeEveryDays;
  const dayInPeriod = dayIndex % period;
  const restDay = Math.max(1, Math.floor(period / 2));
  const shore = dayInPeriod === 0 ? [{ from: 8, to: 20 }] : [];
  const plan: DayPlan = {
    dayIndex,
    clearness,
    meanTemperature,
    summer,
    shore,
    targetHour: 22,
    coldChargingAllowed,
  };
  if (coldChargingAllowed) plan.shore = [{ from: 0, to: 8 }, ...shore];
  if (dayInPeriod === 0) return plan;
  if (dayInPeriod <= restDay) {
    // Steered toward the rest depth over the days before the night away, an equal share per day.
    const left = restDay - dayInPeriod + 1;
    const target = restTarget + (1 - restTarget) * ((left - 1) / left);
    // The owner stays in for a cold-charging night: no night away just before it.
    if (dayInPeriod < restDay || coldDays.includes(dayIndex + 1)) {
      return { ...plan, targetStateOfCharge: target };
    }
    return { ...plan, targetStateOfCharge: target, switchOffHour: 22 };
  }
  return { ...plan, targetStateOfCharge: 0.3 + 0.4 * rng() };
}

/** Draws the state of charge (fraction) of a period's night away. */
export function drawRestTarget(usage: UsagePattern, rng: Rng): number {
  const [low, high] = usage.restStateOfCharge;
  return low + (high - low) * rng();
}

/** Indices of the two cold-charging days, about ten days either side of the coldest, counted from the day at `start`. */
export function coldChargingDays(start: number, days: number, climate: YearClimate): number[] {
  const found: number[] = [];
  for (let d = 0; d < days; d++) {
    const doy = dayOfYear(start + d * DAY_MS);
    if (doy === climate.coldestDayOfYear - 10 || doy === climate.coldestDayOfYear + 11) found.push(d);
  }
  return found.slice(0, 2);
}

// Life-cycle figures computed straight from the minutes (summed as they pass, then every figure at once over the
// whole history), written independently of the incremental accumulator in shared/src/health so a spec can hold
// one against the other.
import { ChargeEpisode, LifeCycleFigures, MinuteSummary, TemperatureBand } from '@cellwarden/shared';

const HOUR_MS = 3_600_000;

interface HourTally {
  start: number;
  ahIn: number;
  whIn: number;
  whOut: number;
  temperatures: number[];
  socs: number[];
}

/** Sums and per-hour lists of a stream of minutes, kept without the minutes themselves. */
export interface MinuteTally {
  ahIn: number;
  ahOut: number;
  whIn: number;
  whOut: number;
  hours: Map<number, HourTally>;
}

/** An empty tally. */
export function emptyTally(): MinuteTally {
  return { ahIn: 0, ahOut: 0, whIn: 0, whOut: 0, hours: new Map() };
}

/** Adds one minute to the tally. */
export function tallyMinute(tally: MinuteTally, m: MinuteSummary): void {
  tally.ahIn += m.ahIn;
  tally.ahOut += m.ahOut;
  tally.whIn += m.whIn ?? 0;
  tally.whOut += m.whOut ?? 0;
  const start = Math.floor(m.start / HOUR_MS) * HOUR_MS;
  const hour = tally.hours.get(start) ?? { start, ahIn: 0, whIn: 0, whOut: 0, temperatures: [], socs: [] };
  hour.ahIn += m.ahIn;
  hour.whIn += m.whIn ?? 0;
  hour.whOut += m.whOut ?? 0;
  hour.temperatures.push(m.temperatureMean);
  if (m.socLast !== undefined) hour.socs.push(m.socLast);
  tally.hours.set(start, hour);
}

/** The figures of the tallied minutes for a battery of `usableAh`, by the same definitions as the accumulator. */
export function straightLifeCycleFigures(tally: MinuteTally, usableAh: number): LifeCycleFigures {
  const hours = [...tally.hours.values()].sort((a, b) => a.start - b.start);
  const fulls = hours.flatMap((h, i) => (Math.max(...h.socs) >= 99 ? [i] : []));
  const between = hours.slice((fulls[0] ?? 0) + 1, (fulls[fulls.length - 1] ?? 0) + 1);
  const betweenIn = between.reduce((t, h) => t + h.whIn, 0);
  return {
    equivalentFullCycles: tally.ahOut / usableAh,
    ahIn: tally.ahIn,
    ahOut: tally.ahOut,
    whIn: tally.whIn,
    whOut: tally.whOut,
    ...(betweenIn > 0 ? { chargeEfficiency: between.reduce((t, h) => t + h.whOut, 0) / betweenIn } : {}),
    depthOfDischarge: depthHistogram(hours.map((h) => h.socs[h.socs.length - 1])),
    temperatureHours: bandHours(hours),
    hotAtHighChargeHours: hours.filter((h) => Math.max(...h.socs) >= 90 && mean(h.temperatures) >= 35).length,
    coldCharging: episodes(hours, usableAh, (h) => Math.min(...h.temperatures) < 0),
    hotCharging: episodes(hours, usableAh, (h) => Math.max(...h.temperatures) > 45),
    hoursCovered: hours.length,
  };
}

function mean(values: readonly number[]): number {
  return values.reduce((t, v) => t + v, 0) / values.length;
}

function bandHours(hours: readonly HourTally[]): { band: TemperatureBand; hours: number }[] {
  const bands: [TemperatureBand, (t: number) => boolean][] = [
    ['below-0', (t) => t < 0],
    ['0-10', (t) => t >= 0 && t < 10],
    ['10-35', (t) => t >= 10 && t < 35],
    ['35-45', (t) => t >= 35 && t <= 45],
    ['above-45', (t) => t > 45],
  ];
  return bands.map(([band, inBand]) => ({
    band,
    hours: hours.filter((h) => inBand(mean(h.temperatures))).length,
  }));
}

function episodes(
  hours: readonly HourTally[],
  usableAh: number,
  outside: (h: HourTally) => boolean,
): ChargeEpisode[] {
  const found: ChargeEpisode[] = [];
  for (const h of hours) {
    if (!(h.ahIn >= 0.002 * usableAh && outside(h))) continue;
    const last = found[found.length - 1];
    const low = Math.min(...h.temperatures);
    const high = Math.max(...h.temperatures);
    if (last?.end === h.start) {
      found[found.length - 1] = {
        ...last,
        end: h.start + HOUR_MS,
        ahIn: last.ahIn + h.ahIn,
        lowestTemperature: Math.min(last.lowestTemperature, low),
        highestTemperature: Math.max(last.highestTemperature, high),
      };
    } else {
      found.push({
        start: h.start,
        end: h.start + HOUR_MS,
        ahIn: h.ahIn,
        lowestTemperature: low,
        highestTemperature: high,
      });
    }
  }
  return found;
}

/** Batch rainflow over the whole series: turning points first, then the three-point rule, then the residue. */
function depthHistogram(
  series: readonly number[],
): { fromPercent: number; toPercent: number; cycles: number }[] {
  const counts = new Array<number>(10).fill(0);
  const add = (range: number, cycles: number) => {
    if (range > 0) counts[Math.min(9, Math.floor(range / 10))] += cycles;
  };
  const stack: number[] = [];
  for (const point of turningPoints(series)) {
    stack.push(point);
    while (stack.length >= 3) {
      const x = Math.abs(stack[stack.length - 1] - stack[stack.length - 2]);
      const y = Math.abs(stack[stack.length - 2] - stack[stack.length - 3]);
      if (x < y) break;
      if (stack.length === 3) {
        add(y, 0.5);
        stack.shift();
      } else {
        add(y, 1);
        stack.splice(stack.length - 3, 2);
      }
    }
  }
  for (let i = 1; i < stack.length; i++) add(Math.abs(stack[i] - stack[i - 1]), 0.5);
  return counts.map((cycles, i) => ({ fromPercent: i * 10, toPercent: (i + 1) * 10, cycles }));
}

function turningPoints(series: readonly number[]): number[] {
  const distinct = series.filter((v, i) => i === 0 || v !== series[i - 1]);
  return distinct.filter((v, i) => {
    if (i === 0 || i === distinct.length - 1) return true;
    return (v - distinct[i - 1]) * (distinct[i + 1] - v) < 0;
  });
}

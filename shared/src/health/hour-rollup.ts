// Minutes rolled up into clock hours, the way the hourly rollups summarise them: for seeding history from
// generated minutes and for checking incremental figures against a straight computation.
import { HourSummary, MinuteSummary } from './health-types';

const HOUR_MS = 3_600_000;

/** One hour's summary of its minutes (all from the same clock hour, in order; at least one). */
export function rollUpHour(minutes: readonly MinuteSummary[]): HourSummary {
  const first = minutes[0];
  const hour: HourSummary = {
    start: Math.floor(first.start / HOUR_MS) * HOUR_MS,
    ahIn: 0,
    ahOut: 0,
    whIn: 0,
    whOut: 0,
    temperatureMin: Infinity,
    temperatureMax: -Infinity,
    temperatureMean: 0,
    readingCount: minutes.length,
  };
  for (const m of minutes) {
    hour.ahIn += m.ahIn;
    hour.ahOut += m.ahOut;
    // Without stored watt-hours, the minute's last voltage stands for the whole minute.
    hour.whIn += m.whIn ?? m.ahIn * m.voltageLast;
    hour.whOut += m.whOut ?? m.ahOut * m.voltageLast;
    hour.temperatureMin = Math.min(hour.temperatureMin, m.temperatureMean);
    hour.temperatureMax = Math.max(hour.temperatureMax, m.temperatureMean);
    hour.temperatureMean += m.temperatureMean / minutes.length;
    if (m.socLast !== undefined) addStateOfCharge(hour, m.socLast);
  }
  return hour;
}

function addStateOfCharge(hour: HourSummary, soc: number): void {
  hour.socMin = Math.min(hour.socMin ?? soc, soc);
  hour.socMax = Math.max(hour.socMax ?? soc, soc);
  hour.socLast = soc;
}

/** Clock hours of a stream of minutes in order, each yielded once its hour is over (the last at the end). */
export function* hoursOf(minutes: Iterable<MinuteSummary>): Generator<HourSummary> {
  let batch: MinuteSummary[] = [];
  for (const minute of minutes) {
    if (batch.length > 0 && Math.floor(minute.start / HOUR_MS) !== Math.floor(batch[0].start / HOUR_MS)) {
      yield rollUpHour(batch);
      batch = [];
    }
    batch.push(minute);
  }
  if (batch.length > 0) yield rollUpHour(batch);
}

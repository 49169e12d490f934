import { QueryTypes, type Sequelize } from 'sequelize';
import {
  rollUpHour,
  createCapacityTracker,
  createLifeCycleAccumulator,
  type CapacitySample,
  type HourSummary,
  type MinuteSummary,
} from '@cellwarden/shared';
import { batterySetupOf } from '../../server/src/battery-health/battery-health-job';
import { createHealthHistoryImport } from '../../server/src/battery-health/health-history-import';
import { SCENARIOS } from '../../simulator/src/scenario-catalog';
import { yearOfUse } from '../../simulator/src/year-of-use';
import { DEMO_DEVICES } from './demo-scenario';

const HOUR_MS = 3600_000;
const DAY_MS = 86_400_000;
const HOUR_BATCH = 1000;
const hourStart = (minutes: readonly MinuteSummary[]) => Math.floor(minutes[0].start / HOUR_MS) * HOUR_MS;

/** The demo system whose battery has a year behind it: the winter van, whose story is charging in the cold. */
export const DEMO_YEAR_SYSTEM = 'van' as const;
/** Seed of the demo year (the week after it is seeded by demo-history with its own seeds). */
export const DEMO_YEAR_SEED = 2026;

/** One hour as rollups_1h stores it: the health summary of its minutes plus the voltage and current columns. */
export interface HourRollup extends HourSummary {
  voltageMin: number;
  voltageMax: number;
  voltageSum: number;
  voltageLast: number;
  currentMin: number;
  currentMax: number;
  currentSum: number;
  currentLast: number;
  temperatureSum: number;
  temperatureLast: number;
  socSum: number | null;
  socCount: number;
  lastMinute: number;
}

/**
 * An hour's rollup row from its minutes (one reading per minute, as the demo week stores them): the health
 * summary is shared/'s own `rollUpHour`, the other columns are added here.
 */
export function hourRollupOf(minutes: readonly MinuteSummary[]): HourRollup {
  const last = minutes[minutes.length - 1];
  const socs = minutes.flatMap((m) => (m.socLast === undefined ? [] : [m.socLast]));
  const sum = (pick: (m: MinuteSummary) => number) => minutes.reduce((total, m) => total + pick(m), 0);
  return {
    ...rollUpHour(minutes),
    voltageMin: Math.min(...minutes.map((m) => m.voltageMin)),
    voltageMax: Math.max(...minutes.map((m) => m.voltageMax)),
    voltageSum: sum((m) => m.voltageLast),
    voltageLast: last.voltageLast,
    currentMin: Math.min(...minutes.map((m) => m.currentMin)),
    currentMax: Math.max(...minutes.map((m) => m.currentMax)),
    currentSum: sum((m) => m.currentMean),
    currentLast: last.currentMean,
    temperatureSum: sum((m) => m.temperatureMean),
    temperatureLast: last.temperatureMean,
    socSum: socs.length > 0 ? socs.reduce((a, b) => a + b, 0) : null,
    socCount: socs.length,
    lastMinute: last.start,
  };
}

const INSERT_HOURS = `INSERT INTO rollups_1h (system_id, bucket_start, reading_count, voltage_min, voltage_max,
    voltage_sum, voltage_last, current_min, current_max, current_sum, current_last, temperature_min,
    temperature_max, temperature_sum, temperature_last, soc_min, soc_max, soc_sum, soc_count, soc_last,
    last_measured_at, soc_last_at, ah_in, ah_out, wh_in, wh_out)
  SELECT $1, to_timestamp(t.start / 1000.0), t.n, t.vmin, t.vmax, t.vsum, t.vlast, t.imin, t.imax, t.isum, t.ilast,
    t.tmin, t.tmax, t.tsum, t.tlast, t.smin, t.smax, t.ssum, t.scount, t.slast, to_timestamp(t.lastat / 1000.0),
    CASE WHEN t.scount > 0 THEN to_timestamp(t.lastat / 1000.0) END, t.ahin, t.ahout, t.whin, t.whout
  FROM unnest($2::float8[], $3::int[], $4::float8[], $5::float8[], $6::float8[], $7::float8[], $8::float8[],
    $9::float8[], $10::float8[], $11::float8[], $12::float8[], $13::float8[], $14::float8[], $15::float8[],
    $16::float8[], $17::float8[], $18::float8[], $19::int[], $20::float8[], $21::float8[], $22::float8[],
    $23::float8[], $24::float8[], $25::float8[])
    AS t(start, n, vmin, vmax, vsum, vlast, imin, imax, isum, ilast, tmin, tmax, tsum, tlast, smin, smax, ssum,
      scount, slast, lastat, ahin, ahout, whin, whout)
  ON CONFLICT (system_id, bucket_start) DO NOTHING`;

async function insertHours(sequelize: Sequelize, systemId: string, hours: readonly HourRollup[]) {
  const col = <T>(pick: (h: HourRollup) => T) => hours.map(pick);
  await sequelize.query(INSERT_HOURS, {
    bind: [
      systemId,
      col((h) => h.start),
      col((h) => h.readingCount),
      col((h) => h.voltageMin),
      col((h) => h.voltageMax),
      col((h) => h.voltageSum),
      col((h) => h.voltageLast),
      col((h) => h.currentMin),
      col((h) => h.currentMax),
      col((h) => h.currentSum),
      col((h) => h.currentLast),
      col((h) => h.temperatureMin),
      col((h) => h.temperatureMax),
      col((h) => h.temperatureSum),
      col((h) => h.temperatureLast),
      col((h) => h.socMin ?? null),
      col((h) => h.socMax ?? null),
      col((h) => h.socSum),
      col((h) => h.socCount),
      col((h) => h.socLast ?? null),
      col((h) => h.lastMinute + 59_000),
      col((h) => h.ahIn),
      col((h) => h.ahOut),
      col((h) => h.whIn),
      col((h) => h.whOut),
    ],
  });
}

/**
 * Gives the demo van a year of battery life before `end` (the start of its seeded week), through the rollups
 * only: the generator's minutes go straight into the capacity tracker and are folded into hour rollups in
 * memory (no raw readings, no minute rollups), the hours go into rollups_1h and the life-cycle accumulator, and
 * the samples and the checkpoint are stored as the health job would have left them. The year's cold-charging
 * nights become past alerts. Nothing is done when the van already has health figures.
 */
export async function seedDemoBatteryYear(
  sequelize: Sequelize,
  options: { end: number; days?: number; log?: (line: string) => void },
): Promise<{ hours: number; samples: number; episodes: number } | undefined> {
  const device = DEMO_DEVICES.find((d) => d.system === DEMO_YEAR_SYSTEM)!;
  const [row] = await sequelize.query<{ systemId: string }>(
    'SELECT system_id AS "systemId" FROM devices WHERE id = :id',
    { replacements: { id: device.id }, type: QueryTypes.SELECT },
  );
  if (!row) return undefined;
  const history = createHealthHistoryImport(sequelize);
  const system = await history.systemWithoutHistory(row.systemId);
  if (!system) return undefined;
  // The year ends on the last whole hour before the week, so no hour bucket holds both.
  const end = Math.floor(options.end / HOUR_MS) * HOUR_MS;
  const days = options.days ?? 365;
  const start = end - days * DAY_MS;
  const tracker = createCapacityTracker(batterySetupOf(system));
  const accumulator = createLifeCycleAccumulator(system.usableCapacityAh);
  const samples: CapacitySample[] = [];
  let pending: HourRollup[] = [];
  const writes: Promise<unknown>[] = [];
  let hours = 0;
  let readings = 0;
  const longitude = SCENARIOS[device.scenario].location.longitude;
  let minutesOfHour: MinuteSummary[] = [];
  const closeHour = () => {
    const hour = hourRollupOf(minutesOfHour);
    minutesOfHour = [];
    accumulator.push(hour);
    hours += 1;
    readings += hour.readingCount;
    pending.push(hour);
    if (pending.length >= HOUR_BATCH) {
      writes.push(insertHours(sequelize, system.id, pending));
      pending = [];
    }
  };
  for (const { minute } of yearOfUse({ seed: DEMO_YEAR_SEED, start, days, longitude })) {
    if (minute.start >= end) break;
    if (minutesOfHour.length > 0 && Math.floor(minute.start / HOUR_MS) * HOUR_MS !== hourStart(minutesOfHour))
      closeHour();
    const sample = tracker.push(minute);
    if (sample) samples.push(sample);
    minutesOfHour.push(minute);
  }
  if (minutesOfHour.length > 0) closeHour();
  if (pending.length > 0) writes.push(insertHours(sequelize, system.id, pending));
  await Promise.all(writes);

  const figures = accumulator.figures();
  await history.save(
    {
      systemId: system.id,
      capacityState: tracker.state(),
      minutesThrough: end,
      lifecycleState: accumulator.state(),
      hoursThrough: end,
      usableAh: system.usableCapacityAh,
      hoursReadingCount: readings,
      lateRebuilds: 0,
      coveredFrom: start,
    },
    samples,
  );
  await history.recordColdCharging(system.id, figures.coldCharging);
  options.log?.(
    `demo battery year ${device.id}: ${hours} hours, ${samples.length} capacity estimates, ${figures.coldCharging.length} cold-charging nights`,
  );
  return { hours, samples: samples.length, episodes: figures.coldCharging.length };
}

import fc from 'fast-check';
import { QueryTypes, type Sequelize } from 'sequelize';
import type { BatteryReading } from '@cellwarden/shared';
import { migrateToLatest } from '../../db/migrator';
import { seedDemoScenario } from '../../db/seeders/demo-scenario';
import { connectDatabase } from '../../server/src/database/connect-database';
import {
  createReadingsRepository,
  type ReadingRow,
  type ReadingsRepository,
} from '../../server/src/telemetry/readings-repository';
import { expectedBuckets } from '../reliability/rollup-reference';
import { createTestDatabase } from '../support/test-database';

jest.setTimeout(120000);

const MINUTE = 60_000;
const HOUR = 3_600_000;
let database: Awaited<ReturnType<typeof createTestDatabase>>;
let sequelize: Sequelize;
let repository: ReadingsRepository;
// A fixed hour well inside the partitions the migrations create.
const T0 = Math.floor((Date.now() - 40 * 24 * HOUR) / HOUR) * HOUR;

beforeAll(async () => {
  database = await createTestDatabase();
  sequelize = connectDatabase(database.url);
  await migrateToLatest(sequelize);
  await seedDemoScenario(sequelize);
  repository = createReadingsRepository(sequelize);
});
afterAll(async () => {
  await sequelize.close();
  await database.drop();
});

/** A fresh system (a copy of a demo one) so each case starts with no readings and no rollups. */
async function newSystem(): Promise<string> {
  const [row] = await sequelize.query<{ id: string }>(
    `INSERT INTO systems (name, kind, chemistry, nominal_voltage, rated_capacity_ah, usable_capacity_ah, owner_id)
     SELECT 'rollup case', kind, chemistry, nominal_voltage, rated_capacity_ah, usable_capacity_ah, owner_id
     FROM systems LIMIT 1 RETURNING id`,
    { type: QueryTypes.SELECT },
  );
  return row.id;
}

interface StoredBucket {
  bucketStart: number;
  readingCount: number;
  voltageMin: number;
  voltageMax: number;
  voltageSum: number;
  currentLast: number;
  socCount: number;
  socSum: number | null;
  socLast: number | null;
  lastMeasuredAt: number;
  ahIn: number;
  ahOut: number;
  whIn: number;
  whOut: number;
}

async function storedBuckets(table: 'rollups_1m' | 'rollups_1h', systemId: string) {
  return sequelize.query<StoredBucket>(
    `SELECT round(extract(epoch FROM bucket_start) * 1000)::float8 AS "bucketStart", reading_count AS "readingCount",
       voltage_min AS "voltageMin", voltage_max AS "voltageMax", voltage_sum AS "voltageSum",
       current_last AS "currentLast", soc_count AS "socCount", soc_sum AS "socSum", soc_last AS "socLast",
       round(extract(epoch FROM last_measured_at) * 1000)::float8 AS "lastMeasuredAt",
       ah_in AS "ahIn", ah_out AS "ahOut", wh_in AS "whIn", wh_out AS "whOut"
     FROM ${table} WHERE system_id = :systemId ORDER BY bucket_start`,
    { replacements: { systemId }, type: QueryTypes.SELECT },
  );
}

/** Every rollup column worked out from the distinct readings alone (energy from the shared reference). */
function referenceBuckets(readings: readonly BatteryReading[], bucketMs: number): StoredBucket[] {
  const distinct = [...new Map(readings.map((r) => [r.measuredAt, r])).values()].sort(
    (a, b) => a.measuredAt - b.measuredAt,
  );
  return expectedBuckets(distinct, bucketMs).map((energy) => {
    const inBucket = distinct.filter(
      (r) => r.measuredAt >= energy.bucketStart && r.measuredAt < energy.bucketStart + bucketMs,
    );
    const withSoc = inBucket.filter((r) => r.stateOfCharge !== undefined);
    const last = inBucket[inBucket.length - 1];
    return {
      ...energy,
      voltageMin: Math.min(...inBucket.map((r) => r.voltage)),
      voltageMax: Math.max(...inBucket.map((r) => r.voltage)),
      voltageSum: inBucket.reduce((sum, r) => sum + r.voltage, 0),
      currentLast: last.current,
      socCount: withSoc.length,
      socSum: withSoc.length ? withSoc.reduce((sum, r) => sum + r.stateOfCharge!, 0) : null,
      socLast: withSoc.length ? withSoc[withSoc.length - 1].stateOfCharge! : null,
      lastMeasuredAt: last.measuredAt,
    };
  });
}

/** Equal counts, extremes and last values; sums equal up to rounding (added in another order; −0 is 0). */
function expectSameBuckets(stored: StoredBucket[], expected: StoredBucket[]) {
  const round = (b: StoredBucket) =>
    Object.fromEntries(
      Object.entries(b).map(([k, v]) => [k, typeof v === 'number' ? Math.round(v * 1e9) / 1e9 + 0 : v]),
    );
  expect(stored.map(round)).toEqual(expected.map(round));
}

const rowsOf = (systemId: string, readings: readonly BatteryReading[]): ReadingRow[] =>
  readings.map((reading) => ({ systemId, deviceId: 'rollup-case-monitor', reading }));

it('charges no energy to a reading after a silence, as worked by hand', async () => {
  const systemId = await newSystem();
  // Hand-worked (Q = I·t, E = V·I·t, general reference): the first reading has no reading before it and counts
  // nothing; 36 A over the next 10 s = 0.1 Ah in, ×12.5 V = 1.25 Wh; 20 minutes of silence, so the reading after
  // it counts nothing; 60 s later −7.2 A = 0.12 Ah out, ×12 V = 1.44 Wh.
  const readings: BatteryReading[] = [
    { measuredAt: T0, voltage: 12.5, current: 10, temperature: 20 },
    { measuredAt: T0 + 10_000, voltage: 12.5, current: 36, temperature: 20 },
    { measuredAt: T0 + 1_210_000, voltage: 12, current: -7.2, temperature: 20 },
    { measuredAt: T0 + 1_270_000, voltage: 12, current: -7.2, temperature: 20 },
  ];
  // Delivered newest first, one at a time: every reading after the first arrives late.
  for (const reading of [...readings].reverse()) await repository.insertBatch(rowsOf(systemId, [reading]));
  const energy = (b: StoredBucket) => [b.bucketStart - T0, b.readingCount, b.ahIn, b.ahOut, b.whIn, b.whOut];
  const minutes = (await storedBuckets('rollups_1m', systemId)).map(energy);
  expect(minutes.map((m) => m.map((v) => Math.round(v * 1e9) / 1e9))).toEqual([
    [0, 2, 0.1, 0, 1.25, 0],
    [20 * MINUTE, 1, 0, 0, 0, 0],
    [21 * MINUTE, 1, 0, 0.12, 0, 1.44],
  ]);
  const [hour] = (await storedBuckets('rollups_1h', systemId)).map(energy);
  expect(hour.map((v) => Math.round(v * 1e9) / 1e9)).toEqual([0, 4, 0.1, 0.12, 1.25, 1.44]);
});

const readingArbitrary = fc.record({
  // Within 40 minutes, on whole seconds, so gaps above and below the 300 s cap both occur.
  second: fc.integer({ min: 0, max: 2400 }),
  voltage: fc.integer({ min: 1150, max: 1450 }).map((v) => v / 100),
  current: fc.integer({ min: -800, max: 800 }).map((c) => c / 10),
  stateOfCharge: fc.option(fc.integer({ min: 0, max: 100 }), { nil: undefined }),
});

it('keeps every rollup equal to the raw readings whatever the order, batching and redelivery', async () => {
  await fc.assert(
    fc.asyncProperty(
      fc.array(readingArbitrary, { minLength: 1, maxLength: 40 }),
      fc.array(fc.integer({ min: 1, max: 8 }), { minLength: 1, maxLength: 10 }),
      fc.array(fc.nat(), { maxLength: 10 }),
      async (generated, batchSizes, redelivered) => {
        const systemId = await newSystem();
        const readings: BatteryReading[] = generated.map((g) => ({
          measuredAt: T0 + 30 * MINUTE + g.second * 1000,
          voltage: g.voltage,
          current: g.current,
          temperature: 15,
          ...(g.stateOfCharge === undefined ? {} : { stateOfCharge: g.stateOfCharge }),
        }));
        const distinct = [...new Map(readings.map((r) => [r.measuredAt, r])).values()];
        // Deliveries in the generated order, with some readings delivered again later.
        const deliveries = [...distinct, ...redelivered.map((k) => distinct[k % distinct.length])];
        for (let i = 0, b = 0; i < deliveries.length; b++) {
          const size = batchSizes[b % batchSizes.length];
          await repository.insertBatch(rowsOf(systemId, deliveries.slice(i, i + size)));
          i += size;
        }
        expectSameBuckets(await storedBuckets('rollups_1m', systemId), referenceBuckets(distinct, MINUTE));
        expectSameBuckets(await storedBuckets('rollups_1h', systemId), referenceBuckets(distinct, HOUR));
      },
    ),
    { numRuns: 25 },
  );
});

it('keeps the rollups exact when two writers store interleaved readings of one system at once', async () => {
  const systemId = await newSystem();
  const readings: BatteryReading[] = Array.from({ length: 400 }, (_, i) => ({
    measuredAt: T0 + 2 * HOUR + i * 5_000,
    voltage: 13 + (i % 7) / 10,
    current: ((i % 11) - 5) * 3,
    temperature: 12,
  }));
  const even = readings.filter((_, i) => i % 2 === 0);
  const odd = readings.filter((_, i) => i % 2 === 1);
  const inBatches = async (part: BatteryReading[]) => {
    for (let i = 0; i < part.length; i += 20)
      await repository.insertBatch(rowsOf(systemId, part.slice(i, i + 20)));
  };
  await Promise.all([inBatches(even), inBatches(odd), inBatches(odd.slice(50, 120))]);
  expectSameBuckets(await storedBuckets('rollups_1m', systemId), referenceBuckets(readings, MINUTE));
  expectSameBuckets(await storedBuckets('rollups_1h', systemId), referenceBuckets(readings, HOUR));
});

it('stores one batch whose readings jump between months far from now, each in its own partition', async () => {
  const systemId = await newSystem();
  // Months the migrations did not create: the batch goes back and forth between them, and the last one
  // is a month the repository saw before (its cached month must not hide a new one).
  const at = (year: number, month: number, day: number) => Date.UTC(year, month, day, 12);
  const times = [at(2031, 1, 27), at(2031, 0, 31), at(2031, 1, 28), at(2029, 2, 1), at(2031, 0, 30)];
  const readings = times.map((measuredAt, i) => ({ measuredAt, voltage: 13.2, current: -i, temperature: 8 }));
  const stored = await repository.insertBatch(rowsOf(systemId, readings));
  expect(stored).toHaveLength(times.length);
  const rows = await sequelize.query<{ at: Date; partition: string }>(
    `SELECT measured_at AS at, tableoid::regclass::text AS partition FROM readings WHERE system_id = :systemId
     ORDER BY measured_at`,
    { replacements: { systemId }, type: QueryTypes.SELECT },
  );
  expect(rows.map((r) => new Date(r.at).getTime())).toEqual([...times].sort((a, b) => a - b));
  expect(new Set(rows.map((r) => r.partition)).size).toBe(3);
  // A redelivery of the whole batch adds nothing and is reported as nothing new.
  expect(await repository.insertBatch(rowsOf(systemId, readings))).toEqual([]);
});

it('reports exactly the readings of a batch that were new when some of it was stored before', async () => {
  const systemId = await newSystem();
  const readings: BatteryReading[] = Array.from({ length: 6 }, (_, i) => ({
    measuredAt: T0 + 3 * HOUR + i * 1000,
    voltage: 13.1,
    current: 2,
    temperature: 10,
  }));
  await repository.insertBatch(rowsOf(systemId, [readings[1], readings[4]]));
  const stored = await repository.insertBatch(rowsOf(systemId, readings));
  expect(stored.map((r) => r.reading.measuredAt)).toEqual([0, 2, 3, 5].map((i) => readings[i].measuredAt));
});

import { writeFileSync, rmSync, chmodSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Client } from 'pg';
import type { Sequelize } from 'sequelize';
import { createReadingsRepository, type ReadingRow } from '../server/src/telemetry/readings-repository';

/** Readings of `systems` systems at 1 Hz from `start`, system by system within each second. */
export function syntheticRows(systems: readonly string[], count: number, start: number): ReadingRow[] {
  return Array.from({ length: count }, (_, i) => {
    const systemId = systems[i % systems.length];
    const second = Math.floor(i / systems.length);
    return {
      systemId,
      deviceId: `bench-${i % systems.length}`,
      reading: {
        measuredAt: start + second * 1000,
        voltage: 13 + (second % 50) / 100,
        current: ((second % 40) - 20) / 2,
        temperature: 12,
        stateOfCharge: 70,
      },
    };
  });
}

async function emptyReadings(client: Client) {
  await client.query('TRUNCATE readings, rollups_1m, rollups_1h');
  await client.query('CHECKPOINT');
}

const rate = (rows: number, ms: number) => Math.round((rows * 1000) / ms);

/** PostgreSQL's own COPY into the readings table, from a server-side file (the fastest way in). */
export async function copyCeiling(url: string, rows: ReadingRow[]): Promise<number> {
  const file = join(tmpdir(), `cw-bench-copy-${process.pid}.csv`);
  const lines = rows.map(
    ({ systemId, deviceId, reading: r }) =>
      `${systemId},${new Date(r.measuredAt).toISOString()},${deviceId},${r.voltage},${r.current},${r.temperature},${r.stateOfCharge},,,${new Date().toISOString()}`,
  );
  writeFileSync(file, lines.join('\n') + '\n');
  chmodSync(file, 0o644); // read by the cluster's own system user
  const client = new Client({ connectionString: url });
  await client.connect();
  try {
    await emptyReadings(client);
    const started = performance.now();
    await client.query(
      `COPY readings (system_id, measured_at, device_id, voltage, current, temperature, state_of_charge, power,
         source_currents, received_at) FROM '${file}' WITH (FORMAT csv)`,
    );
    return rate(rows.length, performance.now() - started);
  } finally {
    await client.end();
    rmSync(file, { force: true });
  }
}

async function inParallel<T>(parts: T[][], write: (part: T[], lane: number) => Promise<void>) {
  await Promise.all(parts.map((part, lane) => write(part, lane)));
}

/** Splits rows into `lanes` by system (as the batch writer does) and each lane into batches. */
function lanesOf(rows: ReadingRow[], lanes: number, batch: number): ReadingRow[][][] {
  const systems = [...new Set(rows.map((r) => r.systemId))];
  return Array.from({ length: lanes }, (_, lane) => {
    const mine = rows.filter((r) => systems.indexOf(r.systemId) % lanes === lane);
    return Array.from({ length: Math.ceil(mine.length / batch) }, (_, b) =>
      mine.slice(b * batch, (b + 1) * batch),
    );
  });
}

/** Multi-row INSERT … ON CONFLICT DO NOTHING, batches of 500 on two connections: no rollups, nothing else. */
export async function insertCeiling(url: string, rows: ReadingRow[]): Promise<number> {
  const clients = [new Client({ connectionString: url }), new Client({ connectionString: url })];
  await Promise.all(clients.map((c) => c.connect()));
  try {
    await emptyReadings(clients[0]);
    const started = performance.now();
    await inParallel(lanesOf(rows, 2, 500), async (batches, lane) => {
      for (const batch of batches) {
        const values: unknown[] = [];
        const tuples = batch.map(({ systemId, deviceId, reading: r }, i) => {
          values.push(
            systemId,
            new Date(r.measuredAt),
            deviceId,
            r.voltage,
            r.current,
            r.temperature,
            r.stateOfCharge,
          );
          return `($${i * 7 + 1}, $${i * 7 + 2}, $${i * 7 + 3}, $${i * 7 + 4}, $${i * 7 + 5}, $${i * 7 + 6}, $${i * 7 + 7})`;
        });
        await clients[lane].query(
          `INSERT INTO readings (system_id, measured_at, device_id, voltage, current, temperature, state_of_charge)
           VALUES ${tuples.join(', ')} ON CONFLICT DO NOTHING`,
          values,
        );
      }
    });
    return rate(rows.length, performance.now() - started);
  } finally {
    await Promise.all(clients.map((c) => c.end()));
  }
}

/** The product's own storage step (readings and both rollups in one transaction), batches of 500, two lanes. */
export async function productStorage(url: string, sequelize: Sequelize, rows: ReadingRow[]): Promise<number> {
  const client = new Client({ connectionString: url });
  await client.connect();
  await emptyReadings(client).finally(() => client.end());
  const repository = createReadingsRepository(sequelize);
  await repository.insertBatch(rows.slice(0, 1)); // creates the partitions outside the timing
  const started = performance.now();
  await inParallel(lanesOf(rows.slice(1), 2, 500), async (batches) => {
    for (const batch of batches) await repository.insertBatch(batch);
  });
  return rate(rows.length - 1, performance.now() - started);
}

import { connectAsync } from 'mqtt';
import { QueryTypes, type Sequelize } from 'sequelize';
import { encodeReadingPack, readingsTopic, type BatteryReading } from '@cellwarden/shared';
import { until } from './http-session';
import { subscribedStream } from './cluster-session';

/** A device of the benchmark fleet: its id, the secret it shares with the template device, and its system. */
export interface FleetDevice {
  id: string;
  systemId: string;
}

/**
 * Copies the template device's system `count` times, each with one device `cw-bench-<n>` that signs in with
 * the template device's secret (its hash is copied), so no new secrets need hashing.
 */
export async function createBenchFleet(
  sequelize: Sequelize,
  templateDeviceId: string,
  count: number,
): Promise<FleetDevice[]> {
  return sequelize.query<FleetDevice>(
    `WITH template AS (
       SELECT s.*, d.secret_hash FROM systems s JOIN devices d ON d.system_id = s.id WHERE d.id = :templateDeviceId
     ), copies AS (
       INSERT INTO systems (name, kind, chemistry, nominal_voltage, rated_capacity_ah, usable_capacity_ah, owner_id,
         installer_company_id)
       SELECT 'Bench system ' || n, kind, chemistry, nominal_voltage, rated_capacity_ah, usable_capacity_ah, owner_id,
         installer_company_id FROM template, generate_series(1, :count) n
       RETURNING id, name
     )
     INSERT INTO devices (id, system_id, secret_hash)
     SELECT 'cw-bench-' || substring(c.name FROM '[0-9]+$'), c.id, t.secret_hash FROM copies c, template t
     RETURNING id, system_id AS "systemId"`,
    { replacements: { templateDeviceId, count }, type: QueryTypes.SELECT },
  );
}

/** Plausible readings one second apart from `from` (a slow sine of charge and discharge). */
export function benchReadings(from: number, count: number): BatteryReading[] {
  return Array.from({ length: count }, (_, i) => ({
    measuredAt: from + i * 1000,
    voltage: 13.2 + 0.1 * Math.sin(i / 300),
    current: 5 * Math.sin(i / 300),
    temperature: 17.5,
    stateOfCharge: 70,
  }));
}

/**
 * Uploads readings as a device with a backlog does: packs of `perPack`, QoS 1, each awaited. Resolves to the
 * moments (performance.now) of the first publish and of the last acknowledgement, leaving the connect out.
 */
export async function uploadBacklog(
  brokerUrl: string,
  device: { id: string; secret: string },
  readings: readonly BatteryReading[],
  perPack = 20,
): Promise<{ firstPublish: number; lastAck: number }> {
  const client = await connectAsync(brokerUrl, {
    username: device.id,
    password: device.secret,
    clientId: `${device.id}/bench`,
    reconnectPeriod: 0,
  });
  try {
    const firstPublish = performance.now();
    for (let i = 0; i < readings.length; i += perPack) {
      const pack = encodeReadingPack(device.id, readings.slice(i, i + perPack));
      await client.publishAsync(readingsTopic(device.id), JSON.stringify(pack), { qos: 1 });
    }
    return { firstPublish, lastAck: performance.now() };
  } finally {
    await client.endAsync();
  }
}

/** Figures of one fleet benchmark run. */
export interface FleetBenchmark {
  devices: number;
  readings: number;
  seconds: number;
  storedRows: number;
  liveOnDashboard: number;
}

/**
 * `devices` copies of the template device upload `perDevice` readings each, spread over the brokers in turn,
 * while one dashboard stream (on `dashboardPort`) follows every one of their systems.
 */
export async function runFleetBenchmark(options: {
  sequelize: Sequelize;
  brokers: readonly string[];
  dashboardPort: number;
  token: string;
  template: { id: string; secret: string };
  devices: number;
  perDevice: number;
}): Promise<FleetBenchmark> {
  const fleet = await createBenchFleet(options.sequelize, options.template.id, options.devices);
  const stream = await subscribedStream(
    options.dashboardPort,
    options.token,
    fleet.map((d) => d.systemId),
  );
  const from = Date.now() - 48 * 3600_000;
  const windows = await Promise.all(
    fleet.map((d, i) =>
      uploadBacklog(
        options.brokers[i % options.brokers.length],
        { id: d.id, secret: options.template.secret },
        benchReadings(from, options.perDevice),
      ),
    ),
  );
  const lastAck = Math.max(...windows.map((w) => w.lastAck));
  const seconds = (lastAck - Math.min(...windows.map((w) => w.firstPublish))) / 1000;
  const readings = fleet.length * options.perDevice;
  const live = () => stream.messages.filter((m) => m.type === 'reading').length;
  await until(() => live() >= readings, 30000).catch(() => undefined);
  stream.socket.close();
  const [{ rows }] = await options.sequelize.query<{ rows: string }>(
    "SELECT count(*) AS rows FROM readings WHERE device_id LIKE 'cw-bench-%'",
    { type: QueryTypes.SELECT },
  );
  return { devices: fleet.length, readings, seconds, storedRows: Number(rows), liveOnDashboard: live() };
}

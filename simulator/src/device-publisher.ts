import { BatteryReading, encodeReadingPack, readingsTopic } from '@cellwarden/shared';
import type { IClientOptions, MqttClient } from 'mqtt';
import { DevicePlan } from './fleet';
import { isOffline, OfflineSchedule } from './offline-schedule';
import { Scenario } from './scenario';
import { playScenario } from './simulate-readings';

/** What publishing needs from the outside world. */
export interface PublisherDeps {
  connect: (url: string, options: IClientOptions) => Promise<MqttClient>;
  now: () => number;
  stdout: (text: string) => void;
  /** Waits in real time; paced runs wait with it. */
  sleep?: (ms: number) => Promise<void>;
}

/** How one device plays its scenario onto the broker. */
export interface PublishSchedule {
  broker: string;
  start: number;
  intervalSeconds: number;
  /** Readings to send; undefined runs until the process stops. */
  count?: number;
  /** Pace readings: simulated seconds per real second, never sending a reading before its measured time. */
  speed?: number;
  offline?: OfflineSchedule;
}

// Backlog readings go in packs of this many, each reading with its own time: well under the 64 KiB limit.
const BACKLOG_PACK_READINGS = 20;

/** The one place a device's MQTT client is made: a stable client id and a persistent session (clean: false). */
export async function connectDevice(
  deps: PublisherDeps,
  broker: string,
  device: DevicePlan,
): Promise<MqttClient> {
  const client = await deps.connect(broker, {
    username: device.id,
    password: device.secret,
    clientId: `cw-sim-${device.id}`,
    clean: false,
    keepalive: 30,
    // A broker that answers "server unavailable" (its database away) is retried, not given up on.
    reconnectOnConnackError: true,
  });
  // mqtt.js reconnects by itself after a network error; say so rather than crash on an unhandled 'error'.
  client.on('error', (error) => deps.stdout(`${device.id}: connection error: ${error.message}\n`));
  return client;
}

async function publish(client: MqttClient, deviceId: string, readings: readonly BatteryReading[]) {
  for (let i = 0; i < readings.length; i += BACKLOG_PACK_READINGS) {
    const pack = encodeReadingPack(deviceId, readings.slice(i, i + BACKLOG_PACK_READINGS));
    // QoS 1: the broker acknowledges only after storing; awaiting each keeps the order of measured time.
    await client.publishAsync(readingsTopic(deviceId), JSON.stringify(pack), { qos: 1 });
  }
}

function dueAt(schedule: PublishSchedule, realStart: number, measuredAt: number): number {
  if (schedule.speed === undefined) return -Infinity;
  return Math.max(realStart + (measuredAt - schedule.start) / schedule.speed, measuredAt);
}

// The monitor's link: connected or not, and the readings it holds while away.
interface Link {
  client?: MqttClient;
  backlog: BatteryReading[];
}

const stamp = (at: number) => new Date(at).toISOString();

async function dropOff(deps: PublisherDeps, device: DevicePlan, link: Link, at: number): Promise<void> {
  if (!link.client) return;
  deps.stdout(`${device.id}: offline at ${stamp(at)}; buffering readings\n`);
  await link.client.endAsync();
  link.client = undefined;
}

async function sendWithBacklog(
  deps: PublisherDeps,
  broker: string,
  device: DevicePlan,
  link: Link,
  reading?: BatteryReading,
): Promise<void> {
  if (!link.client) {
    link.client = await connectDevice(deps, broker, device);
    const when = reading ? `at ${stamp(reading.measuredAt)}` : 'at the end of the run';
    deps.stdout(`${device.id}: reconnected ${when}; sending ${link.backlog.length} buffered readings\n`);
  }
  const batch = link.backlog.splice(0, link.backlog.length).concat(reading ? [reading] : []);
  await publish(link.client, device.id, batch);
}

/** Plays one device's scenario onto the broker, dropping off and catching up on the offline schedule. */
export async function publishDevice(
  deps: PublisherDeps,
  device: DevicePlan,
  scenario: Scenario,
  schedule: PublishSchedule,
): Promise<void> {
  const realStart = deps.now();
  const link: Link = { client: await connectDevice(deps, schedule.broker, device), backlog: [] };
  let taken = 0;
  // An unpaced run of a set count with a steady link goes as fast as the broker acknowledges: readings
  // travel in packs. With an offline schedule each reading goes on its own, so the drops stay visible.
  const burst =
    schedule.speed === undefined && schedule.count !== undefined && schedule.offline === undefined;
  const pack: BatteryReading[] = [];
  try {
    const options = { seed: device.seed, start: schedule.start, intervalSeconds: schedule.intervalSeconds };
    for (const { reading } of playScenario(scenario, options)) {
      if (schedule.count !== undefined && taken >= schedule.count) break;
      taken++;
      const wait = dueAt(schedule, realStart, reading.measuredAt) - deps.now();
      if (wait > 0 && deps.sleep) await deps.sleep(wait);
      if (isOffline(schedule.offline, schedule.start, reading.measuredAt)) {
        await dropOff(deps, device, link, reading.measuredAt);
        link.backlog.push(reading);
      } else if (burst) {
        link.backlog.push(reading);
        if (link.backlog.length >= BACKLOG_PACK_READINGS)
          await sendWithBacklog(deps, schedule.broker, device, link);
      } else {
        await sendWithBacklog(deps, schedule.broker, device, link, reading);
      }
    }
    if (link.client && pack.length > 0) await publish(link.client, device.id, pack.splice(0));
    if (link.backlog.length > 0) await sendWithBacklog(deps, schedule.broker, device, link);
  } finally {
    await link.client?.endAsync();
  }
}

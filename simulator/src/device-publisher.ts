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
  /**
   * Resume a timeline already stored: readings measured before this instant are computed (so the pack's
   * state carries on from them) but not sent, and the rest go out live at their measured time.
   */
  resumeAt?: number;
  /** Report as a second monitor on the same bank (see SimulationOptions.monitorSeed). */
  monitorSeed?: number;
}

// Backlog readings go in packs of this many, each reading with its own time: well under the 64 KiB limit.
const BACKLOG_PACK_READINGS = 20;

// MQTT 3.1.1 §3.2.2.3: identifier rejected, bad user name or password, not authorized.
const REFUSALS = new Set([2, 4, 5]);

/** Back-off before connect attempt n (0-based) after a failed first connect: 1 s, 2 s, 4 s … capped at 30 s. */
export function connectRetryDelay(attempt: number): number {
  return Math.min(1000 * 2 ** attempt, 30_000);
}

/**
 * The one place a device's MQTT client is made: its own device id as client id (the broker refuses any
 * other) and a persistent session (clean: false). Like a real monitor it never gives up: a first connect
 * that fails (broker busy or restarting, database away) is tried again with back-off, and mqtt.js
 * reconnects by itself once connected.
 */
export async function connectDevice(
  deps: PublisherDeps,
  broker: string,
  device: DevicePlan,
): Promise<MqttClient> {
  const options: IClientOptions = {
    username: device.id,
    password: device.secret,
    clientId: device.id,
    clean: false,
    keepalive: 30,
    // A broker that answers "server unavailable" (its database away) is retried, not given up on.
    reconnectOnConnackError: true,
  };
  const sleep = deps.sleep ?? ((ms: number) => new Promise((resolve) => setTimeout(resolve, ms)));
  for (let attempt = 0; ; attempt++) {
    try {
      const client = await deps.connect(broker, options);
      client.on('error', (error) => deps.stdout(`${device.id}: connection error: ${error.message}\n`));
      return client;
    } catch (error) {
      // Refused credentials or client id (CONNACK 2, 4, 5) will not mend by waiting: say so and stop.
      if (REFUSALS.has((error as { code?: number }).code ?? -1)) throw error;
      const wait = connectRetryDelay(attempt);
      deps.stdout(
        `${device.id}: could not connect (${(error as Error).message}); retrying in ${wait / 1000} s\n`,
      );
      await sleep(wait);
    }
  }
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
  // A resumed timeline is paced from the instant it resumes at, so its next reading is due when measured.
  const simulatedStart = schedule.resumeAt ?? schedule.start;
  return Math.max(realStart + (measuredAt - simulatedStart) / schedule.speed, measuredAt);
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
    const options = {
      seed: device.seed,
      start: schedule.start,
      intervalSeconds: schedule.intervalSeconds,
      monitorSeed: schedule.monitorSeed,
    };
    for (const { reading } of playScenario(scenario, options)) {
      if (schedule.resumeAt !== undefined && reading.measuredAt < schedule.resumeAt) continue;
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

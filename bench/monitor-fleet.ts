import { connect, type MqttClient } from 'mqtt';
import { encodeReadingPack, readingsTopic, type BatteryReading } from '@cellwarden/shared';
import type { Monitor } from './product-node';

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/** Monitors connected to one broker, each on its own MQTT connection, resending unacknowledged QoS 1 packs. */
export interface Fleet {
  clients: MqttClient[];
  /** Connections closed while the fleet was not closing them itself. */
  disconnects(): number;
  connected(): number;
  /** Milliseconds until every monitor is connected (again), or Infinity after `timeoutMs`. */
  allConnected(timeoutMs: number): Promise<number>;
  close(): Promise<void>;
}

/** Connects the monitors spread evenly over `rampMs`, as a fleet powering up does, not all in one instant. */
export async function connectFleet(
  url: string,
  monitors: readonly Monitor[],
  rampMs: number,
): Promise<Fleet> {
  let closing = false;
  let disconnects = 0;
  const clients = monitors.map((m, i) => {
    const client = connect(url, {
      username: m.deviceId,
      password: m.secret,
      clientId: m.deviceId, // the broker takes only the device's own id as client id
      clean: false,
      // A real monitor backs off after a lost connection; spread so a restart is not met by one wall of CONNECTs.
      reconnectPeriod: 1000 + Math.floor(Math.random() * 1000),
      connectTimeout: 30_000,
      keepalive: 60,
      manualConnect: true,
    });
    client.on('close', () => {
      if (!closing) disconnects++;
    });
    client.on('error', () => undefined);
    setTimeout(() => client.connect(), (rampMs * i) / monitors.length);
    return client;
  });
  const fleet: Fleet = {
    clients,
    disconnects: () => disconnects,
    connected: () => clients.filter((c) => c.connected).length,
    async allConnected(timeoutMs) {
      const started = performance.now();
      while (fleet.connected() < clients.length) {
        if (performance.now() - started > timeoutMs) return Infinity;
        await sleep(20);
      }
      return performance.now() - started;
    },
    async close() {
      closing = true;
      await Promise.all(clients.map((c) => c.endAsync(true).catch(() => undefined)));
    },
  };
  return fleet;
}

const reading = (measuredAt: number, k: number): BatteryReading => ({
  measuredAt,
  voltage: 13 + (k % 30) / 100,
  current: ((k % 20) - 10) / 2,
  temperature: 14,
  stateOfCharge: 65,
});

/**
 * Every monitor sends `packs` packs of `packSize` readings (a backlog, say) as fast as they are acknowledged,
 * up to `window` unacknowledged at once. Resolves once all are acknowledged (at QoS 1 on the product: stored).
 */
export async function sendBacklog(
  fleet: Fleet,
  monitors: readonly Monitor[],
  options: { packs: number; packSize: number; window: number; start: number },
): Promise<{ messages: number; readings: number; ms: number }> {
  const started = performance.now();
  await Promise.all(
    monitors.map(async (m, i) => {
      const client = fleet.clients[i];
      let next = 0;
      const lane = async () => {
        for (let k = next++; k < options.packs; k = next++) {
          const pack = Array.from({ length: options.packSize }, (_, j) =>
            reading(options.start + (k * options.packSize + j) * 1000, j),
          );
          await client.publishAsync(
            readingsTopic(m.deviceId),
            JSON.stringify(encodeReadingPack(m.deviceId, pack)),
            {
              qos: 1,
            },
          );
        }
      };
      await Promise.all(Array.from({ length: options.window }, lane));
    }),
  );
  const messages = monitors.length * options.packs;
  return { messages, readings: messages * options.packSize, ms: performance.now() - started };
}

/**
 * Every monitor publishes one reading a second (phases spread over the second) for `seconds`; `sent` gets each
 * reading's key (system|measured time) and the instant it was handed to MQTT. Resolves when all are acknowledged.
 */
export async function publishAtOneHertz(
  fleet: Fleet,
  monitors: readonly Monitor[],
  seconds: number,
  sent: Map<string, number>,
): Promise<{ published: number; acknowledged: number }> {
  const start = Math.floor(Date.now() / 1000) * 1000 - 2000;
  let acknowledged = 0;
  await Promise.all(
    monitors.map(async (m, i) => {
      await sleep(Math.floor((1000 * i) / monitors.length));
      const client = fleet.clients[i];
      const pending: Promise<unknown>[] = [];
      const first = performance.now();
      for (let k = 0; k < seconds; k++) {
        const wait = first + k * 1000 - performance.now();
        if (wait > 0) await sleep(wait);
        const measuredAt = start + k * 1000;
        sent.set(`${m.systemId}|${measuredAt}`, performance.now());
        const payload = JSON.stringify(encodeReadingPack(m.deviceId, [reading(measuredAt, k)]));
        pending.push(
          client.publishAsync(readingsTopic(m.deviceId), payload, { qos: 1 }).then(() => acknowledged++),
        );
      }
      // Bounded: a reading not acknowledged within a minute after the run counts as not acknowledged.
      await Promise.race([Promise.allSettled(pending), sleep(60_000)]);
    }),
  );
  return { published: monitors.length * seconds, acknowledged };
}

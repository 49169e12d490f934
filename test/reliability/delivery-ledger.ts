import { connectAsync, type IClientOptions, type MqttClient } from 'mqtt';
import { QueryTypes, type Sequelize } from 'sequelize';
import { parseReadingPayload } from '@cellwarden/shared';
import { run } from '../../simulator/src/run';

/**
 * What a device handed to its MQTT client (sent) and what the broker acknowledged (acked), by measured
 * time, plus the errors its clients reported.
 */
export function createDeliveryLedger() {
  const sent = new Set<number>();
  const acked = new Set<number>();
  const errors: string[] = [];
  let packets = 0;
  const timesOf = (message: string | Buffer) =>
    parseReadingPayload(typeof message === 'string' ? message : new Uint8Array(message), {
      now: Date.now(),
    }).readings.map((r) => r.measuredAt);

  /** mqtt.js connectAsync, with every client it makes noting what it sends and what is acknowledged. */
  async function connect(url: string, options: IClientOptions): Promise<MqttClient> {
    const client = await connectAsync(url, { reconnectPeriod: 250, connectTimeout: 5000, ...options });
    client.on('error', (error) => errors.push(error.message));
    client.on('packetsend', (packet) => {
      if (packet.cmd === 'publish') packets++;
    });
    const publishAsync = client.publishAsync.bind(client);
    client.publishAsync = (async (topic: string, message: string | Buffer, opts?: object) => {
      const times = timesOf(message);
      times.forEach((t) => sent.add(t));
      const result = await publishAsync(topic, message, opts as never);
      times.forEach((t) => acked.add(t));
      return result;
    }) as MqttClient['publishAsync'];
    return client;
  }

  return {
    sent,
    acked,
    errors,
    connect,
    /** PUBLISH packets mqtt.js reported writing; resends from its store are not always among them. */
    get packets() {
      return packets;
    },
  };
}

export type DeliveryLedger = ReturnType<typeof createDeliveryLedger>;

/** Runs the simulator library for one device through the ledger; resolves to its exit code. */
export function runSimulatedDevice(
  ledger: DeliveryLedger,
  options: { broker: string; device: { id: string; secret: string }; args: string[] },
): Promise<{ code: number; stderr: string }> {
  let stderr = '';
  const argv = ['--broker', options.broker, '--device', `${options.device.id}:${options.device.secret}`];
  return run([...argv, ...options.args], {
    connect: ledger.connect,
    now: Date.now,
    stdout: () => undefined,
    stderr: (text) => (stderr += text),
  }).then((code) => ({ code, stderr }));
}

/** Measured times (ms) of a device's stored readings, and how many rows hold them. */
export async function storedTimes(sequelize: Sequelize, deviceId: string) {
  const rows = await sequelize.query<{ at: string }>(
    `SELECT round(extract(epoch FROM measured_at) * 1000)::bigint AS at FROM readings
     WHERE device_id = :deviceId ORDER BY measured_at`,
    { replacements: { deviceId }, type: QueryTypes.SELECT },
  );
  return { times: new Set(rows.map((r) => Number(r.at))), rows: rows.length };
}

/** Lost (acknowledged or sent but not stored), extra (stored, never sent) and duplicated rows. */
export function compareDelivery(sent: Set<number>, stored: { times: Set<number>; rows: number }) {
  return {
    lost: [...sent].filter((t) => !stored.times.has(t)).length,
    extra: [...stored.times].filter((t) => !sent.has(t)).length,
    duplicated: stored.rows - stored.times.size,
  };
}

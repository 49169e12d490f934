import type { IClientOptions, MqttClient } from 'mqtt';
import { parseReadingPayload } from '@cellwarden/shared';
import { run } from '../../simulator/src/run';
import { createDeliveryLedger, type DeliveryLedger } from '../reliability/delivery-ledger';

/** A simulated device that knows several nodes (mqtt.js tries them in turn on reconnect) and when it sent what. */
export function createClusterDevice(brokers: readonly string[]) {
  const ledger: DeliveryLedger = createDeliveryLedger();
  /** Wall-clock time each reading (by measured time) was handed to the MQTT client, first send only. */
  const sentAt = new Map<number, number>();
  const servers = brokers.map((url) => {
    const { hostname, port } = new URL(url);
    return { host: hostname, port: Number(port), protocol: 'mqtt' as const };
  });

  async function connect(url: string, options: IClientOptions): Promise<MqttClient> {
    const client = await ledger.connect(url, { ...options, servers });
    const publishAsync = client.publishAsync.bind(client);
    client.publishAsync = ((topic: string, message: string | Buffer, opts?: object) => {
      const text = typeof message === 'string' ? message : message.toString('utf8');
      const { readings } = parseReadingPayload(new TextEncoder().encode(text), { now: Date.now() });
      for (const r of readings) if (!sentAt.has(r.measuredAt)) sentAt.set(r.measuredAt, Date.now());
      return publishAsync(topic, message, opts as never);
    }) as MqttClient['publishAsync'];
    return client;
  }

  return {
    ledger,
    sentAt,
    /** Runs the simulator library as this device; resolves to its exit code and what it wrote to stderr. */
    run(device: { id: string; secret: string }, args: string[]): Promise<{ code: number; stderr: string }> {
      let stderr = '';
      const argv = ['--broker', brokers[0], '--device', `${device.id}:${device.secret}`, ...args];
      return run(argv, {
        connect,
        now: Date.now,
        sleep: (ms) => new Promise((resolve) => setTimeout(resolve, ms)),
        stdout: () => undefined,
        stderr: (text) => (stderr += text),
      }).then((code) => ({ code, stderr }));
    },
  };
}

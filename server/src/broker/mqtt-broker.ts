import { Aedes, type AedesOptions, type Client, type PublishPacket } from 'aedes';
import { deviceIdFromReadingsTopic } from '@cellwarden/shared';
import { createServer, type AddressInfo, type Server } from 'node:net';
import type { Logger } from '../logger';
import type { createBrokerPolicy } from './broker-policy';
import { MAX_MQTT_PACKET_BYTES, PacketSizeGuard } from './packet-size-guard';

/** The embedded MQTT broker on a TCP listener. Persistence and emitter are aedes' in-memory defaults unless given. */
export interface MqttBroker {
  port: number;
  close(): Promise<void>;
}

/** Starts aedes with the policy hooks on host:port (port 0 takes a free one). */
export async function startMqttBroker(options: {
  host: string;
  port: number;
  policy: ReturnType<typeof createBrokerPolicy>;
  logger: Logger;
  /** A shared emitter (cluster mode); absent keeps aedes' in-process one. */
  mq?: AedesOptions['mq'];
  /** A shared persistence for sessions and in-flight messages (cluster mode); absent keeps memory. */
  persistence?: AedesOptions['persistence'];
}): Promise<MqttBroker> {
  const stores = {
    ...(options.mq && { mq: options.mq }),
    ...(options.persistence && { persistence: options.persistence }),
  };
  const { authenticate, authorizePublish, authorizeSubscribe } = options.policy;
  const broker = await Aedes.createBroker({
    authenticate,
    authorizePublish,
    authorizeSubscribe,
    ...stores,
    heartbeatInterval: 30000,
  });
  skipRoutingOfReadings(broker);
  broker.on('clientError', (client, error) =>
    options.logger.debug('mqtt client error', { clientId: client.id, error: error.message }),
  );
  // Every connection reaches aedes through the guard, which refuses an oversized packet by its header.
  const server: Server = createServer((socket) =>
    broker.handle(
      new PacketSizeGuard(socket, MAX_MQTT_PACKET_BYTES, () =>
        options.logger.warn('mqtt packet over the size limit; connection closed', {
          address: socket.remoteAddress,
          limitBytes: MAX_MQTT_PACKET_BYTES,
        }),
      ),
    ),
  );
  server.on('error', (error) => options.logger.error('mqtt listener error', { error: error.message }));
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port, options.host, () => resolve());
  });
  return {
    port: (server.address() as AddressInfo).port,
    async close() {
      await new Promise<void>((resolve) => broker.close(() => resolve()));
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
}

type Publish = (packet: PublishPacket, client: Client | null, done?: (error?: Error | null) => void) => void;

/**
 * A device's readings are stored by `authorizePublish`, before aedes writes the PUBACK, and nobody receives them
 * over MQTT: devices may not subscribe (every SUBSCRIBE is refused) and the server consumes nothing through the
 * broker. aedes still routed each acknowledged publish (a packet copy, a match against the persisted
 * subscriptions, the emitter, a retained copy when flagged) for nobody; a device's publish to its readings topic
 * now ends once stored and acknowledged. Everything else ($SYS, wills) is routed as before.
 */
export function skipRoutingOfReadings(broker: Aedes): void {
  const instance = broker as unknown as { publish: Publish };
  const route = instance.publish.bind(broker) as Publish;
  instance.publish = (packet, client, done) => {
    // aedes also takes (packet, done) from its own $SYS publishes: those go on unchanged.
    if (client && typeof client === 'object' && deviceIdFromReadingsTopic(packet.topic) !== undefined)
      return done?.(null);
    route(packet, client, done);
  };
}

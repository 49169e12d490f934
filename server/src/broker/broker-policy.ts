import type { AedesOptions, Client } from 'aedes';
import { deviceIdFromReadingsTopic } from '@cellwarden/shared';
import type { DevicesService, AuthenticatedDevice } from '../devices/devices-service';
import type { IngestService } from '../ingest/ingest-service';
import type { Logger } from '../logger';

// Every broker access decision lives here: who may connect, publish and subscribe.

const devicesByClient = new WeakMap<Client, AuthenticatedDevice>();

/** MQTT 3.1.1 CONNACK return codes (OASIS MQTT 3.1.1, §3.2.2.3). */
const BAD_USERNAME_OR_PASSWORD = 4;

function authError(message: string) {
  return Object.assign(new Error(message), { returnCode: BAD_USERNAME_OR_PASSWORD });
}

/** The broker's authenticate/authorizePublish/authorizeSubscribe hooks. */
export function createBrokerPolicy(deps: {
  devices: DevicesService;
  ingest: IngestService;
  logger: Logger;
}): Pick<AedesOptions, 'authenticate' | 'authorizePublish' | 'authorizeSubscribe'> {
  return {
    authenticate(client, username, password, done) {
      const secret = password ? Buffer.from(password).toString('utf8') : '';
      deps.devices.authenticate(username ?? '', secret).then(
        (device) => {
          if (!device) {
            deps.logger.warn('device refused at connect', { username, clientId: client.id });
            return done(authError('Bad device id or secret') as never, false);
          }
          devicesByClient.set(client, device);
          done(null, true);
        },
        (error) => {
          deps.logger.error('device authentication failed', { error: String(error) });
          done(Object.assign(new Error('Server unavailable'), { returnCode: 3 }) as never, false);
        },
      );
    },

    // Storage happens here, before aedes writes the PUBACK, so an acknowledged QoS 1 reading is committed.
    authorizePublish(client, packet, callback) {
      const device = client ? devicesByClient.get(client) : undefined;
      if (!device) return callback(new Error('Not a device connection'));
      if (deviceIdFromReadingsTopic(packet.topic) !== device.deviceId) {
        deps.ingest.refuseTopic(device.deviceId, packet.topic);
        return callback(new Error(`Device ${device.deviceId} may not publish to ${packet.topic}`));
      }
      const payload =
        typeof packet.payload === 'string' ? new TextEncoder().encode(packet.payload) : packet.payload;
      deps.ingest.accept(device, payload).then(
        () => callback(null),
        (error) => {
          deps.logger.warn('reading not acknowledged; device will resend', {
            deviceId: device.deviceId,
            error: String(error),
          });
          callback(error);
        },
      );
    },

    // Devices only publish; nothing they could subscribe to is theirs to read.
    authorizeSubscribe(client, subscription, callback) {
      deps.logger.warn('subscribe refused', { clientId: client.id, topic: subscription.topic });
      callback(new Error('Subscriptions are not allowed'), null);
    },
  };
}

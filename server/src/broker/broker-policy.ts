import type { AedesOptions, Client, PublishPacket } from 'aedes';
import { deviceIdFromReadingsTopic } from '@cellwarden/shared';
import type { DevicesService } from '../devices/devices-service';
import type { IngestService } from '../ingest/ingest-service';
import type { Logger } from '../logger';
import { createDeviceSessions } from './device-sessions';

// Every broker access decision lives here: who may connect, publish and subscribe.

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
  /** How often an open connection's credentials are checked again, milliseconds (default 30 s). */
  recheckMs?: number;
}): Pick<AedesOptions, 'authenticate' | 'authorizePublish' | 'authorizeSubscribe'> & {
  credentialsChanged(deviceId: string): void;
} {
  const sessions = createDeviceSessions({ devices: deps.devices, recheckMs: deps.recheckMs });

  // Resolves to the refusal, or null once the payload is stored (or refused as bad input and counted).
  async function publishDecision(client: Client | null, packet: PublishPacket): Promise<Error | null> {
    const device = await sessions.current(client);
    if (!device) {
      deps.logger.warn('publish from a connection without valid device credentials', {
        clientId: client?.id,
      });
      return new Error('Not a device connection, or its credentials were revoked');
    }
    if (deviceIdFromReadingsTopic(packet.topic) !== device.deviceId) {
      deps.ingest.refuseTopic(device.deviceId, packet.topic);
      return new Error(`Device ${device.deviceId} may not publish to ${packet.topic}`);
    }
    const payload =
      typeof packet.payload === 'string' ? new TextEncoder().encode(packet.payload) : packet.payload;
    try {
      await deps.ingest.accept(device, payload);
      return null;
    } catch (error) {
      deps.logger.warn('reading not acknowledged; device will resend', {
        deviceId: device.deviceId,
        error: String(error),
      });
      return error as Error;
    }
  }

  return {
    /** Revocation and rotation take effect on open connections at their next publish, not 30 s later. */
    credentialsChanged: (deviceId) => sessions.credentialsChanged(deviceId),

    authenticate(client, username, password, done) {
      const secret = password ? Buffer.from(password).toString('utf8') : '';
      deps.devices.authenticate(username ?? '', secret).then(
        (device) => {
          if (!device) {
            deps.logger.warn('device refused at connect', { username, clientId: client.id });
            return done(authError('Bad device id or secret') as never, false);
          }
          sessions.open(client, device, secret);
          done(null, true);
        },
        (error) => {
          deps.logger.error('device authentication failed', { error: String(error) });
          done(Object.assign(new Error('Server unavailable'), { returnCode: 3 }) as never, false);
        },
      );
    },

    // Storage happens here, before aedes writes the PUBACK, so an acknowledged QoS 1 reading is committed.
    // An error makes aedes close the connection without a PUBACK (MQTT 3.1.1 has no negative PUBACK).
    authorizePublish(client, packet, callback) {
      void publishDecision(client, packet).then((error) => callback(error));
    },

    // Devices only publish; nothing they could subscribe to is theirs to read. A null subscription makes aedes
    // answer SUBACK 0x80 (Failure, MQTT 3.1.1 §3.9.3) instead of dropping the connection without one (MQTT-3.8.4-1).
    authorizeSubscribe(client, subscription, callback) {
      deps.logger.warn('subscribe refused', { clientId: client.id, topic: subscription.topic });
      callback(null, null);
    },
  };
}

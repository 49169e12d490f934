import type { AedesOptions, Client, PublishPacket } from 'aedes';
import { deviceIdFromReadingsTopic } from '@cellwarden/shared';
import type { DevicesService } from '../devices/devices-service';
import type { IngestService } from '../ingest/ingest-service';
import { createLogThrottle } from '../log-throttle';
import type { Logger } from '../logger';
import { createConnectLimits, type ConnectLimits } from './connect-limits';
import { createDeviceSessions } from './device-sessions';
import type { DeviceRefusals } from './device-refusals';

// Every broker access decision lives here: who may connect, publish and subscribe.

/** MQTT 3.1.1 CONNACK return codes (OASIS MQTT 3.1.1, §3.2.2.3). */
const IDENTIFIER_REJECTED = 2;
const SERVER_UNAVAILABLE = 3;
const BAD_USERNAME_OR_PASSWORD = 4;

const refusal = (returnCode: number, message: string) => Object.assign(new Error(message), { returnCode });

// How long a connect over the per-device failure allowance waits for its answer (slowed, never refused).
const SLOWED_CONNECT_MS = 2000;

/**
 * A device speaks only under its own client id: the device id itself, or the device id and `/` and a
 * suffix (`/` is not in the device-id alphabet, so no device can claim another's). Otherwise a device
 * could take over another's session: MQTT disconnects the older of two connections with one id.
 */
export function isOwnClientId(clientId: string, deviceId: string): boolean {
  return clientId === deviceId || (clientId.startsWith(`${deviceId}/`) && clientId.length <= 128);
}

/** The remote address of a broker connection (the packet-size guard carries it over from the socket). */
const addressOf = (client: Client) =>
  String((client.conn as { remoteAddress?: string } | undefined)?.remoteAddress ?? 'unknown');

/** The broker's authenticate/authorizePublish/authorizeSubscribe hooks. */
export function createBrokerPolicy(deps: {
  devices: DevicesService;
  ingest: IngestService;
  logger: Logger;
  /** How often an open connection's credentials are checked again, milliseconds (default 30 s). */
  recheckMs?: number;
  limits?: ConnectLimits;
  /** Refused connects are counted here per device id (the onboarding screen says why a monitor is silent). */
  refusals?: DeviceRefusals;
}): Pick<AedesOptions, 'authenticate' | 'authorizePublish' | 'authorizeSubscribe'> & {
  credentialsChanged(deviceId: string): void;
} {
  const sessions = createDeviceSessions({ devices: deps.devices, recheckMs: deps.recheckMs });
  const limits = deps.limits ?? createConnectLimits();
  // Refusals are logged as a count per device and interval, not a line per attempt.
  const log = createLogThrottle(deps.logger);

  async function connectDecision(client: Client, deviceId: string, secret: string) {
    const address = addressOf(client);
    const verdict = await limits.verdict(deviceId, address);
    if (verdict === 'refuse') {
      deps.refusals?.count(deviceId, 'credentials', 'too_many_failed_connects');
      return refusal(SERVER_UNAVAILABLE, 'Too many failed connects; try again in a minute');
    }
    if (verdict === 'slow') await new Promise((resolve) => setTimeout(resolve, SLOWED_CONNECT_MS));
    const device = await deps.devices.authenticate(deviceId, secret);
    if (!device) {
      await limits.failed(deviceId, address);
      deps.refusals?.count(deviceId, 'credentials', 'bad_credentials');
      return refusal(BAD_USERNAME_OR_PASSWORD, 'Bad device id or secret');
    }
    if (!isOwnClientId(client.id, device.deviceId)) {
      deps.refusals?.count(deviceId, 'credentials', 'client_id_rejected');
      return refusal(IDENTIFIER_REJECTED, `Client id must be ${device.deviceId} or ${device.deviceId}/…`);
    }
    await limits.succeeded(deviceId, address);
    sessions.open(client, device, secret);
    return null;
  }

  // Resolves to the refusal, or null once the payload is stored (or refused as bad input and counted).
  async function publishDecision(client: Client | null, packet: PublishPacket): Promise<Error | null> {
    const device = await sessions.current(client);
    if (!device) {
      log.warn(`publish:${client?.id}`, 'publish from a connection without valid device credentials', {
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
      log.warn(`unacked:${device.deviceId}`, 'reading not acknowledged; device will resend', {
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
      connectDecision(client, String(username ?? '').slice(0, 100), secret).then(
        (refused) => {
          if (!refused) return done(null, true);
          log.warn(`connect:${String(username)}`, 'device connect refused', {
            deviceId: String(username ?? '').slice(0, 100),
            reason: refused.message,
          });
          done(refused as never, false);
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
      log.warn(`subscribe:${client.id}`, 'subscribe refused', {
        clientId: client.id,
        topic: subscription.topic,
      });
      callback(null, null);
    },
  };
}

import { readingsTopic, type DeviceCredentials, type PublicUser } from '@cellwarden/shared';
import type { AuditService } from '../audit/audit-service';
import { AppError, notFound } from '../errors/app-error';
import type { SystemsService } from '../systems/systems-service';
import { hashDeviceSecret, isLegacyDeviceHash, newDeviceSecret, verifyDeviceSecret } from './device-secret';
import type { DevicesRepository } from './devices-repository';

/** Device ids: what the database accepts, checked before any query. */
export const DEVICE_ID_PATTERN = /^[a-z0-9][a-z0-9-]{2,62}$/;

/** The device a broker connection speaks for, once its credentials check out. */
export interface AuthenticatedDevice {
  deviceId: string;
  systemId: string;
}

/** Device credentials: checked by the broker; added, rotated and revoked by those the policy allows. */
export function createDevicesService(deps: {
  repository: DevicesRepository;
  systems?: SystemsService;
  audit?: AuditService;
  brokerPort?: () => number;
  /** Where monitors reach the broker, shown with their credentials. */
  brokerUrl?: () => string;
  /** Told when a device is revoked or its secret rotated, so the broker checks open connections again. */
  onCredentialsChanged?: (deviceId: string) => void;
}) {
  const managed = async (user: PublicUser, systemId: string) =>
    deps.systems!.getFor(user, systemId, 'manage-devices');

  async function credentials(systemId: string, id: string, secret: string): Promise<DeviceCredentials> {
    return {
      device: (await deps.repository.findListing(systemId, id))!,
      mqttUsername: id,
      mqttPassword: secret,
      mqttTopic: readingsTopic(id),
      brokerPort: deps.brokerPort?.() ?? 1883,
      brokerUrl: deps.brokerUrl?.() ?? `mqtt://127.0.0.1:${deps.brokerPort?.() ?? 1883}`,
    };
  }

  return {
    async authenticate(deviceId: string, secret: string): Promise<AuthenticatedDevice | undefined> {
      const wellFormed = DEVICE_ID_PATTERN.test(deviceId) && secret.length > 0 && secret.length <= 200;
      const device = wellFormed ? await deps.repository.findById(deviceId) : undefined;
      const usable = device && !device.revokedAt ? device : undefined;
      // The same check runs for an unknown, revoked or malformed id, so its time says nothing about the id.
      if (!(await verifyDeviceSecret(secret, usable?.secretHash)) || !usable) return undefined;
      if (isLegacyDeviceHash(usable.secretHash))
        await deps.repository.setSecret(usable.systemId, usable.id, hashDeviceSecret(secret));
      return { deviceId, systemId: usable.systemId };
    },

    async list(user: PublicUser, systemId: string) {
      const system = await deps.systems!.getFor(user, systemId, 'view');
      return deps.repository.listForSystem(system.id);
    },

    /** Adds a monitor and returns its credentials: the only time the secret is shown. */
    async add(user: PublicUser, systemId: string, id: string, label: string): Promise<DeviceCredentials> {
      const system = await managed(user, systemId);
      const secret = newDeviceSecret();
      if (
        !(await deps.repository.insert({
          id,
          systemId: system.id,
          label,
          secretHash: hashDeviceSecret(secret),
        }))
      )
        throw new AppError(
          'device_id_taken',
          409,
          `A device with the id ${id} already exists; choose another`,
          'id',
        );
      await deps.audit?.record(system.id, user, 'device.added', id);
      return credentials(system.id, id, secret);
    },

    async rotate(user: PublicUser, systemId: string, id: string): Promise<DeviceCredentials> {
      const system = await managed(user, systemId);
      const secret = newDeviceSecret();
      if (!(await deps.repository.setSecret(system.id, id, hashDeviceSecret(secret))))
        throw notFound('Device');
      deps.onCredentialsChanged?.(id);
      await deps.audit?.record(system.id, user, 'device.rotated', id);
      return credentials(system.id, id, secret);
    },

    async revoke(user: PublicUser, systemId: string, id: string): Promise<void> {
      const system = await managed(user, systemId);
      if (!(await deps.repository.revoke(system.id, id))) throw notFound('Device');
      deps.onCredentialsChanged?.(id);
      await deps.audit?.record(system.id, user, 'device.revoked', id);
    },
  };
}

export type DevicesService = ReturnType<typeof createDevicesService>;

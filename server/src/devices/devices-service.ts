import { verifyPassword } from '../accounts/password-hashing';
import type { DevicesRepository } from './devices-repository';

/** The device a broker connection speaks for, once its credentials check out. */
export interface AuthenticatedDevice {
  deviceId: string;
  systemId: string;
}

/** Checks device credentials (per-device secret, stored hashed). */
export function createDevicesService(repository: DevicesRepository) {
  return {
    async authenticate(deviceId: string, secret: string): Promise<AuthenticatedDevice | undefined> {
      if (!/^[a-z0-9][a-z0-9-]{2,62}$/.test(deviceId) || secret.length === 0 || secret.length > 200)
        return undefined;
      const device = await repository.findById(deviceId);
      if (!device || device.revokedAt) return undefined;
      return (await verifyPassword(secret, device.secretHash))
        ? { deviceId, systemId: device.systemId }
        : undefined;
    },
  };
}

export type DevicesService = ReturnType<typeof createDevicesService>;

import type { Client } from 'aedes';
import type { AuthenticatedDevice, DevicesService } from '../devices/devices-service';

/** How long a connection's credentials are trusted before its next publish checks them again. */
export const CREDENTIAL_RECHECK_MS = 30_000;

interface DeviceSession {
  device: AuthenticatedDevice;
  secret: string;
  checkedAt: number;
  checking?: Promise<boolean>;
}

/**
 * The device each broker connection speaks for. Credentials are checked at connect and again at most every
 * `recheckMs` while the connection stays open, so a revoked device or a rotated secret stops being accepted
 * on a connection opened before the change, not only on the next one.
 */
export function createDeviceSessions(deps: {
  devices: Pick<DevicesService, 'authenticate'>;
  now?: () => number;
  recheckMs?: number;
}) {
  const sessions = new WeakMap<Client, DeviceSession>();
  // When each device's credentials last changed (revoked, rotated): sessions checked before then check again.
  const changedAt = new Map<string, number>();
  const now = deps.now ?? Date.now;
  const recheckMs = deps.recheckMs ?? CREDENTIAL_RECHECK_MS;

  async function recheck(session: DeviceSession): Promise<boolean> {
    try {
      const device = await deps.devices.authenticate(session.device.deviceId, session.secret);
      if (!device || device.systemId !== session.device.systemId) return false;
      session.checkedAt = now();
      return true;
    } catch {
      // The database is away: the reading cannot be stored now anyway, and ingest waits for it; refusing
      // here would only make every device reconnect into a connect check that fails the same way.
      return true;
    }
  }

  return {
    /** A device was revoked or its secret rotated: its open connections are checked again at their next publish. */
    credentialsChanged(deviceId: string): void {
      changedAt.set(deviceId, now() + 1);
    },
    /** Remembers the device a connection authenticated as, with the secret to check again later. */
    open(client: Client, device: AuthenticatedDevice, secret: string): void {
      sessions.set(client, { device, secret, checkedAt: now() });
    },
    /** The connection's device while its credentials still hold, or undefined (never authenticated, revoked). */
    async current(client: Client | null): Promise<AuthenticatedDevice | undefined> {
      const session = client ? sessions.get(client) : undefined;
      if (!session) return undefined;
      const changed = changedAt.get(session.device.deviceId) ?? Number.NEGATIVE_INFINITY;
      if (now() - session.checkedAt < recheckMs && changed < session.checkedAt) return session.device;
      session.checking ??= recheck(session).finally(() => (session.checking = undefined));
      return (await session.checking) ? session.device : undefined;
    },
  };
}

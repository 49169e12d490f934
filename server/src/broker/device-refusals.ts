import type { MonitorRefusals } from '@cellwarden/shared';

/** What the broker refused a device for. */
export type RefusalKind = NonNullable<MonitorRefusals['last']>['kind'];

/** Devices tracked at most: refused connects name any id a client likes, so the map must not grow with them. */
export const MAX_TRACKED_DEVICES = 10_000;

/**
 * Refusals per device id, for the onboarding screen's "what went wrong". Bounded: when full, the device
 * refused longest ago is forgotten first (a Map keeps insertion order; a counted device is moved to the end).
 * In this node's memory only: in cluster mode each node counts the connections it received.
 */
export function createDeviceRefusals(deps: { now?: () => number; limit?: number } = {}) {
  const now = deps.now ?? Date.now;
  const limit = deps.limit ?? MAX_TRACKED_DEVICES;
  const byDevice = new Map<string, MonitorRefusals>();
  const empty = (): MonitorRefusals => ({ credentials: 0, topic: 0, payload: 0, last: null });

  return {
    /** Counts one refusal of `deviceId` (as the client named itself; cut to 100 characters). */
    count(deviceId: string, kind: RefusalKind, code: string): void {
      const id = deviceId.slice(0, 100);
      const counts = byDevice.get(id) ?? empty();
      byDevice.delete(id);
      counts[kind] += 1;
      counts.last = { kind, code, at: now() };
      byDevice.set(id, counts);
      if (byDevice.size > limit) byDevice.delete(byDevice.keys().next().value!);
    },
    /** The counts of one device (zeros when none). */
    of(deviceId: string): MonitorRefusals {
      return structuredClone(byDevice.get(deviceId) ?? empty());
    },
    /** Forgets a device's counts: a newly added monitor starts clean, whatever was tried under its id before. */
    forget(deviceId: string): void {
      byDevice.delete(deviceId);
    },
    get size() {
      return byDevice.size;
    },
  };
}

export type DeviceRefusals = ReturnType<typeof createDeviceRefusals>;

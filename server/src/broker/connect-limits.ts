import { RateLimiterMemory } from 'rate-limiter-flexible';

/** How many failed connects are tolerated per minute. */
export interface ConnectLimitSettings {
  /** Failures of one device id from one address, then that pair is refused for the rest of the minute. */
  perDeviceAndAddress: number;
  /** Failures from one address (any ids: a scanner), then that address is refused. */
  perAddress: number;
  /** Failures of one device id from everywhere, then its answers are slowed, never refused. */
  perDevice: number;
}

export const DEFAULT_CONNECT_LIMITS: ConnectLimitSettings = {
  perDeviceAndAddress: 10,
  perAddress: 50,
  perDevice: 60,
};

const WINDOW_SECONDS = 60;

/** What to do with a connect attempt before its secret is checked. */
export type ConnectVerdict = 'check' | 'slow' | 'refuse';

/**
 * Brakes on guessing device secrets over MQTT. A misconfigured monitor (retrying every second with a
 * wrong secret) only refuses itself; a scanner trying many ids from one address is refused; and an
 * attacker who tries one id from many addresses slows that id's answers without ever locking the real
 * monitor out. Counters live in this node's memory (per node in cluster mode: a bound, not an exact one).
 */
export function createConnectLimits(settings: ConnectLimitSettings = DEFAULT_CONNECT_LIMITS) {
  const limiter = (points: number) => new RateLimiterMemory({ points, duration: WINDOW_SECONDS });
  const pairs = limiter(settings.perDeviceAndAddress);
  const addresses = limiter(settings.perAddress);
  const devices = limiter(settings.perDevice);
  const used = async (l: RateLimiterMemory, key: string) => (await l.get(key))?.consumedPoints ?? 0;
  const pairKey = (deviceId: string, address: string) => `${deviceId}|${address}`;

  return {
    async verdict(deviceId: string, address: string): Promise<ConnectVerdict> {
      if ((await used(pairs, pairKey(deviceId, address))) >= settings.perDeviceAndAddress) return 'refuse';
      if ((await used(addresses, address)) >= settings.perAddress) return 'refuse';
      if ((await used(devices, deviceId)) >= settings.perDevice) return 'slow';
      return 'check';
    },
    async failed(deviceId: string, address: string): Promise<void> {
      await Promise.all([
        pairs.penalty(pairKey(deviceId, address)),
        addresses.penalty(address),
        devices.penalty(deviceId),
      ]);
    },
    async succeeded(deviceId: string, address: string): Promise<void> {
      await pairs.delete(pairKey(deviceId, address));
    },
  };
}

export type ConnectLimits = ReturnType<typeof createConnectLimits>;

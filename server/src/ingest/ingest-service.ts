import { parseReadingPayload, TelemetryInputError } from '@cellwarden/shared';
import { createLogThrottle } from '../log-throttle';
import type { Logger } from '../logger';
import type { BatchWriter } from './batch-writer';

/** Counts of refused payloads, per device and per reason code. */
export type RefusalCounts = Record<string, Record<string, number>>;

/** Turns a device's MQTT payload into stored readings, or a counted refusal. */
export function createIngestService(deps: {
  writer: BatchWriter;
  logger: Logger;
  now: () => number;
  /** Told of each refusal (the per-device counters the onboarding screen reads). */
  onRefused?: (deviceId: string, code: string) => void;
}) {
  const refusals: RefusalCounts = {};
  // A misbehaving device may send hundreds of bad payloads a second: one line per device and minute.
  const log = createLogThrottle(deps.logger);
  let stored = 0;

  function refuse(deviceId: string, code: string, message: string) {
    const counts = (refusals[deviceId] ??= {});
    counts[code] = (counts[code] ?? 0) + 1;
    deps.onRefused?.(deviceId, code);
    log.warn(`${deviceId}:${code}`, 'reading refused', { deviceId, code, reason: message });
  }

  return {
    /**
     * Resolves once every reading in the payload is committed (or the payload was refused: a bad
     * payload is acknowledged and dropped, so a device does not resend it forever).
     */
    async accept(
      device: { deviceId: string; systemId: string },
      payload: Uint8Array,
    ): Promise<'stored' | 'refused'> {
      let readings;
      try {
        ({ readings } = parseReadingPayload(payload, { now: deps.now(), expectedDeviceId: device.deviceId }));
      } catch (error) {
        if (!(error instanceof TelemetryInputError)) throw error;
        refuse(device.deviceId, error.code, error.message);
        return 'refused';
      }
      await deps.writer.write(readings.map((reading) => ({ ...device, reading })));
      stored += readings.length;
      return 'stored';
    },
    /** Called when a device publishes where it may not. */
    refuseTopic(deviceId: string, topic: string) {
      refuse(deviceId, 'foreign_topic', `may not publish to ${JSON.stringify(topic)}`);
    },
    stats() {
      return { stored, refusals: structuredClone(refusals), queued: deps.writer.queued };
    },
  };
}

export type IngestService = ReturnType<typeof createIngestService>;

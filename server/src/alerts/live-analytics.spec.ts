import type { BatteryReading, FlagEvent } from '@cellwarden/shared';
import { createMemoryLogger } from '../logger';
import type { SettingsRepository, StoredSettings } from '../settings/settings-repository';
import type { ReadingsRepository } from '../telemetry/readings-repository';
import type { AlertsRepository } from './alerts-repository';
import type { AlertsService } from './alerts-service';
import { createLiveAnalytics } from './live-analytics';

const START = Date.UTC(2026, 11, 3, 12);
const VAN = 'van';
const MINUTE = 60_000;

const settings: StoredSettings = {
  name: 'Van',
  kind: 'van',
  timeZone: 'UTC',
  battery: { chemistry: 'lifepo4', nominalVoltage: 12, ratedCapacityAh: 200, usableCapacityAh: 180 },
  bms: { continuousDischargeA: 100, lowVoltageCutoffV: null },
  chargeSources: [],
  thresholds: { silentAfterMinutes: 15 },
};
const reading = (measuredAt: number): BatteryReading => ({
  measuredAt,
  voltage: 13.25,
  current: -3,
  temperature: 18,
  stateOfCharge: 70,
});

/** Settings for one system, a lead monitor, stored readings for replays and quiet systems; alerts kept. */
function fakes(
  options: { lead?: string | null; quiet?: { receivedAt: number; reading: BatteryReading }[] } = {},
) {
  let now = START;
  const recorded: {
    systemId: string;
    system: { name: string; timeZone: string };
    events: readonly FlagEvent[];
  }[] = [];
  const replaySpans: { systemId: string; from: number; to: number; deviceId?: string }[] = [];
  const quietAsked: number[] = [];
  const settingsRepository: Pick<SettingsRepository, 'find'> = {
    find: async (systemId) => (systemId === VAN ? settings : undefined),
  };
  const readings: Pick<ReadingsRepository, 'leadMonitor' | 'listRaw' | 'quietSystems'> = {
    leadMonitor: async () => options.lead ?? null,
    async listRaw(systemId, from, to, deviceId) {
      replaySpans.push({ systemId, from: from.getTime(), to: to.getTime(), deviceId });
      return [];
    },
    async quietSystems(before) {
      quietAsked.push(before.getTime());
      return (options.quiet ?? []).map((q) => ({ systemId: VAN, ...q }));
    },
  };
  const alerts: Pick<AlertsService, 'record'> = {
    record: async (systemId, system, events) => void recorded.push({ systemId, system, events }),
  };
  const alertsRepository: Pick<AlertsRepository, 'insertPastEpisode'> = {
    insertPastEpisode: async () => undefined,
  };
  const analytics = createLiveAnalytics({
    settings: settingsRepository,
    alerts,
    readings,
    alertsRepository,
    publish: () => undefined,
    logger: createMemoryLogger(),
    now: () => now,
  });
  return {
    analytics,
    recorded,
    replaySpans,
    quietAsked,
    advance: (ms: number) => (now += ms),
  };
}

beforeEach(() => jest.useFakeTimers({ now: START }));
afterEach(() => jest.useRealTimers());

describe('live analytics', () => {
  it("derives state from the lead monitor's readings and shows a second monitor's as they are", async () => {
    const { analytics } = fakes({ lead: 'lead-monitor' });
    const [fromLead, fromSecond] = await analytics.process([
      { systemId: VAN, deviceId: 'lead-monitor', reading: reading(START) },
      { systemId: VAN, deviceId: 'second-monitor', reading: reading(START + 1000) },
    ]);
    expect(fromLead).not.toBeNull();
    expect(fromSecond).toBeNull();
  });

  it('feeds every monitor when the system has no lead monitor', async () => {
    const { analytics } = fakes({ lead: null });
    const derived = await analytics.process([
      { systemId: VAN, deviceId: 'any-monitor', reading: reading(START) },
      { systemId: VAN, deviceId: 'other-monitor', reading: reading(START + 1000) },
    ]);
    expect(derived.every((d) => d !== null)).toBe(true);
  });

  it('derives nothing for a system without settings (removed meanwhile)', async () => {
    const { analytics } = fakes();
    expect(await analytics.process([{ systemId: 'gone', deviceId: 'm', reading: reading(START) }])).toEqual([
      null,
    ]);
  });

  it('answers a late reading with the state it already had and replays its span from the stored readings', async () => {
    const { analytics, replaySpans } = fakes({ lead: 'lead-monitor' });
    const row = (t: number) => ({ systemId: VAN, deviceId: 'lead-monitor', reading: reading(t) });
    const [current] = await analytics.process([row(START + 10 * MINUTE)]);
    const [late] = await analytics.process([row(START + 2 * MINUTE)]);
    expect(late).toEqual(current);
    // Not at once: further late packs gather into one replay.
    expect(replaySpans).toEqual([]);
    await analytics.process([row(START + 1 * MINUTE)]);
    await analytics.replayNow();
    // From the earliest late reading less the 30-minute run-up, to just past the newest reading seen.
    expect(replaySpans).toEqual([
      {
        systemId: VAN,
        from: START + MINUTE - 30 * MINUTE,
        to: START + 10 * MINUTE + 1,
        deviceId: 'lead-monitor',
      },
    ]);
  });

  it('adopts a system that fell quiet before the process started and raises its silence on its own clock', async () => {
    const { analytics, recorded, quietAsked, advance } = fakes({
      quiet: [{ receivedAt: START - 5 * MINUTE, reading: reading(START - 5 * MINUTE) }],
    });
    await analytics.sweepSilence();
    // Quiet for 5 minutes of the 15 the settings allow: adopted, nothing raised yet.
    expect(quietAsked).toEqual([START - MINUTE]);
    expect(recorded).toEqual([]);
    advance(11 * MINUTE);
    await analytics.sweepSilence();
    expect(quietAsked).toHaveLength(1);
    expect(recorded).toHaveLength(1);
    expect(recorded[0].systemId).toBe(VAN);
    expect(recorded[0].system).toMatchObject({ name: 'Van', timeZone: 'UTC' });
    expect(recorded[0].events).toEqual([
      expect.objectContaining({ kind: 'device-silent', transition: 'start', value: 16, unit: 'min' }),
    ]);
    // Raised once, not on every sweep.
    advance(MINUTE);
    await analytics.sweepSilence();
    expect(recorded).toHaveLength(1);
  });

  it('leaves a system that is still reporting to its readings, not to the quiet list', async () => {
    const { analytics, recorded } = fakes({
      quiet: [{ receivedAt: START - 20 * MINUTE, reading: reading(START - 20 * MINUTE) }],
    });
    await analytics.process([{ systemId: VAN, deviceId: 'm', reading: reading(START) }]);
    await analytics.sweepSilence();
    expect(recorded.flatMap((r) => r.events).filter((e) => e.kind === 'device-silent')).toEqual([]);
  });
});

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

/** Settings for one system (or the given ones), a lead monitor, stored readings for replays and quiet systems; alerts kept. */
function fakes(
  options: {
    lead?: string | null;
    quiet?: { systemId?: string; receivedAt: number; reading: BatteryReading }[];
    systems?: Map<string, StoredSettings>;
    /** Alerts are stored only once this settles. */
    alertsStored?: Promise<void>;
  } = {},
) {
  let now = START;
  const recorded: {
    systemId: string;
    system: { name: string; timeZone: string };
    events: readonly FlagEvent[];
  }[] = [];
  const replaySpans: { systemId: string; from: number; to: number; deviceId?: string }[] = [];
  const quietAsked: number[] = [];
  const settingsQueries: string[][] = [];
  const systems = options.systems ?? new Map([[VAN, settings]]);
  const settingsRepository: Pick<SettingsRepository, 'findMany'> = {
    async findMany(systemIds) {
      settingsQueries.push([...systemIds]);
      return new Map(systemIds.filter((id) => systems.has(id)).map((id) => [id, systems.get(id)!]));
    },
  };
  const readings: Pick<ReadingsRepository, 'leadMonitors' | 'listRaw' | 'quietSystems'> = {
    leadMonitors: async (systemIds) => new Map(systemIds.map((id) => [id, options.lead ?? null])),
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
    async record(systemId, system, events) {
      await options.alertsStored;
      recorded.push({ systemId, system, events });
    },
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
    settingsQueries,
    systems,
    advance: (ms: number) => (now += ms),
  };
}

// The replay timers are faked; process.nextTick is not: the settings loader gathers a turn's loads into one batch on it.
beforeEach(() => jest.useFakeTimers({ now: START, doNotFake: ['nextTick'] }));
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

  describe('a batch at once (processEach)', () => {
    const row = (systemId: string, t: number, voltage = 13.25) => ({
      systemId,
      deviceId: `${systemId}-m`,
      reading: { ...reading(t), voltage },
    });

    it("hands over every reading's derived state in each system's order, across batches", async () => {
      const systems = new Map([
        ['a', settings],
        ['b', settings],
      ]);
      const { analytics } = fakes({ systems });
      const seen: [string, number, boolean][] = [];
      const onDerived = (r: ReturnType<typeof row>, derived: unknown) =>
        void seen.push([r.systemId, r.reading.measuredAt, derived !== null]);
      analytics.processEach([row('a', START), row('b', START), row('a', START + 1000)], onDerived);
      analytics.processEach([row('b', START + 1000), row('a', START + 2000)], onDerived);
      await jest.runAllTimersAsync();
      expect(seen.filter(([id]) => id === 'a')).toEqual([
        ['a', START, true],
        ['a', START + 1000, true],
        ['a', START + 2000, true],
      ]);
      expect(seen.filter(([id]) => id === 'b')).toEqual([
        ['b', START, true],
        ['b', START + 1000, true],
      ]);
    });

    it("holds a system's next reading until its alert is stored, and no other system's", async () => {
      let store!: () => void;
      const alertsStored = new Promise<void>((resolve) => (store = resolve));
      const systems = new Map([
        ['a', settings],
        ['b', settings],
      ]);
      const { analytics, recorded } = fakes({ systems, alertsStored });
      const seen: string[] = [];
      // 2 V on a 12 V bank: the pack is cut off, a flag with no minimum duration.
      analytics.processEach([row('a', START, 2), row('a', START + 1000), row('b', START)], (r) =>
        seen.push(`${r.systemId}@${r.reading.measuredAt - START}`),
      );
      await jest.advanceTimersByTimeAsync(0);
      expect(seen).toEqual(['b@0']);
      store();
      await jest.advanceTimersByTimeAsync(0);
      expect(seen).toEqual(['b@0', 'a@0', 'a@1000']);
      // Stored in order: the cut-off raised by the first reading, then ended by the second.
      expect(recorded.flatMap((r) => r.events.map((e) => `${e.kind} ${e.transition}`))).toEqual([
        'bms-cutoff-suspected start',
        'bms-cutoff-suspected end',
      ]);
    });

    it('hands over null for the readings of a system without settings', async () => {
      const { analytics } = fakes();
      const seen: unknown[] = [];
      analytics.processEach([row('gone', START)], (_r, derived) => seen.push(derived));
      await jest.runAllTimersAsync();
      expect(seen).toEqual([null]);
    });
  });

  describe('loading settings', () => {
    const row = (systemId: string, t: number) => ({
      systemId,
      deviceId: `${systemId}-m`,
      reading: reading(t),
    });
    const fleet = (count: number) =>
      new Map(Array.from({ length: count }, (_, i) => [`system-${i}`, settings]));

    it('loads a fleet reporting its first readings at once in batched queries, not one per system', async () => {
      const systems = fleet(1200);
      const { analytics, settingsQueries } = fakes({ systems });
      // As the after-commit fan-out hands them over: each reading on its own, all in the same turn.
      const first = await Promise.all(
        [...systems.keys()].map(async (id) => (await analytics.process([row(id, START)]))[0]),
      );
      expect(settingsQueries.map((ids) => ids.length)).toEqual([500, 500, 200]);
      expect(first.every((derived) => derived !== null)).toBe(true);
      // The next readings run on what was loaded.
      await Promise.all([...systems.keys()].map((id) => analytics.process([row(id, START + 1000)])));
      expect(settingsQueries).toHaveLength(3);
    });

    it('runs the readings after a change through the settings API on the changed settings', async () => {
      const { analytics, systems, settingsQueries, recorded, advance } = fakes();
      await analytics.process([row(VAN, START)]);
      systems.set(VAN, { ...settings, thresholds: { silentAfterMinutes: 5 } });
      await analytics.process([row(VAN, START + 1000)]);
      // Nobody said they changed: the loaded settings stand.
      expect(settingsQueries).toHaveLength(1);
      analytics.settingsChanged(VAN);
      await analytics.process([row(VAN, START + 2000)]);
      expect(settingsQueries).toHaveLength(2);
      advance(6 * MINUTE);
      await analytics.sweepSilence();
      // Quiet for 6 minutes: past the changed 5, short of the former 15.
      expect(recorded.flatMap((r) => r.events)).toEqual([
        expect.objectContaining({ kind: 'device-silent', transition: 'start' }),
      ]);
    });

    it('asks again when the settings changed while their load was under way', async () => {
      const { analytics, settingsQueries } = fakes();
      const first = analytics.process([row(VAN, START)]);
      analytics.settingsChanged(VAN);
      await first;
      await analytics.process([row(VAN, START + 1000)]);
      expect(settingsQueries).toHaveLength(2);
      await analytics.process([row(VAN, START + 2000)]);
      expect(settingsQueries).toHaveLength(2);
    });

    it('loses only the readings of a system whose stored settings cannot be resolved', async () => {
      const systems = fleet(3);
      systems.set('system-1', { ...settings, timeZone: 'Mars/Olympus_Mons' });
      const { analytics, settingsQueries } = fakes({ systems });
      const derived = await analytics.process([
        row('system-0', START),
        row('system-1', START),
        row('system-2', START),
      ]);
      expect(settingsQueries).toHaveLength(1);
      expect(derived.map((d) => d !== null)).toEqual([true, false, true]);
    });

    it('adopts quiet systems through the same batched loads, and one that fails stops none of the others', async () => {
      const systems = fleet(3);
      systems.set('system-1', { ...settings, timeZone: 'Mars/Olympus_Mons' });
      const quietSince = START - 5 * MINUTE;
      const { analytics, settingsQueries, recorded, advance } = fakes({
        systems,
        quiet: [...systems.keys()].map((systemId) => ({
          systemId,
          receivedAt: quietSince,
          reading: reading(quietSince),
        })),
      });
      await analytics.sweepSilence();
      expect(settingsQueries).toEqual([['system-0', 'system-1', 'system-2']]);
      advance(11 * MINUTE);
      await analytics.sweepSilence();
      expect(recorded.map((r) => r.systemId).sort()).toEqual(['system-0', 'system-2']);
    });
  });
});

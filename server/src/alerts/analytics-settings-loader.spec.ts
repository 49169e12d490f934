import type { SettingsRepository, StoredSettings } from '../settings/settings-repository';
import type { ReadingsRepository } from '../telemetry/readings-repository';
import { createAnalyticsSettingsLoader } from './analytics-settings-loader';

const START = Date.UTC(2026, 11, 3, 12);

const settingsOf = (name: string, timeZone = 'UTC'): StoredSettings => ({
  name,
  kind: 'cabin',
  timeZone,
  battery: { chemistry: 'lifepo4', nominalVoltage: 24, ratedCapacityAh: 200, usableCapacityAh: 180 },
  bms: { continuousDischargeA: 100, lowVoltageCutoffV: null },
  chargeSources: [],
  thresholds: {},
});

/** Repositories over an in-memory table of systems, keeping every id list each query was asked for. */
function fakes(systems: Map<string, StoredSettings>, options: { failWhenAsked?: string } = {}) {
  const settingsQueries: string[][] = [];
  const leadQueries: string[][] = [];
  const settings: Pick<SettingsRepository, 'findMany'> = {
    async findMany(systemIds) {
      settingsQueries.push([...systemIds]);
      if (options.failWhenAsked && systemIds.includes(options.failWhenAsked))
        throw new Error('connection terminated');
      return new Map(systemIds.filter((id) => systems.has(id)).map((id) => [id, systems.get(id)!]));
    },
  };
  const readings: Pick<ReadingsRepository, 'leadMonitors'> = {
    async leadMonitors(systemIds) {
      leadQueries.push([...systemIds]);
      return new Map(systemIds.filter((id) => systems.has(id)).map((id) => [id, `${id}-shunt`]));
    },
  };
  return { settings, readings, settingsQueries, leadQueries };
}

const fleet = (count: number) =>
  new Map(Array.from({ length: count }, (_, i) => [`system-${i}`, settingsOf(`Cabin ${i}`)]));

describe('analytics settings loader', () => {
  it('answers many systems asked for in the same turn with one settings query and one lead-monitor query', async () => {
    const systems = fleet(300);
    const { settings, readings, settingsQueries, leadQueries } = fakes(systems);
    const load = createAnalyticsSettingsLoader({ settings, readings, now: () => START });
    const profiles = await Promise.all([...systems.keys()].map((id) => load(id)));
    expect(settingsQueries).toEqual([[...systems.keys()]]);
    expect(leadQueries).toEqual([[...systems.keys()]]);
    expect(profiles[7]).toMatchObject({
      name: 'Cabin 7',
      timeZone: 'UTC',
      leadDeviceId: 'system-7-shunt',
      loadedAt: START,
    });
    expect(profiles.every((p) => p?.settings !== undefined)).toBe(true);
  });

  it('never asks one query for more systems than its batch limit', async () => {
    const systems = fleet(1100);
    const { settings, readings, settingsQueries } = fakes(systems);
    const load = createAnalyticsSettingsLoader({ settings, readings, now: () => START, batchLimit: 500 });
    const profiles = await Promise.all([...systems.keys()].map((id) => load(id)));
    expect(settingsQueries.map((ids) => ids.length)).toEqual([500, 500, 100]);
    expect(new Set(settingsQueries.flat()).size).toBe(1100);
    expect(profiles.filter((p) => p !== undefined)).toHaveLength(1100);
  });

  it('answers loads asked for in a later turn with a query of their own', async () => {
    const systems = fleet(2);
    const { settings, readings, settingsQueries } = fakes(systems);
    const load = createAnalyticsSettingsLoader({ settings, readings, now: () => START });
    await load('system-0');
    await load('system-1');
    expect(settingsQueries).toEqual([['system-0'], ['system-1']]);
  });

  it('resolves a system that no longer exists to undefined', async () => {
    const { settings, readings } = fakes(fleet(1));
    const load = createAnalyticsSettingsLoader({ settings, readings, now: () => START });
    const [present, gone] = await Promise.all([load('system-0'), load('removed-system')]);
    expect(present?.name).toBe('Cabin 0');
    expect(gone).toBeUndefined();
  });

  it('rejects only the loads of a system whose stored settings cannot be resolved', async () => {
    const systems = fleet(3);
    systems.set('system-1', settingsOf('Cabin 1', 'Mars/Olympus_Mons'));
    const { settings, readings, settingsQueries } = fakes(systems);
    const load = createAnalyticsSettingsLoader({ settings, readings, now: () => START });
    const outcomes = await Promise.allSettled(['system-0', 'system-1', 'system-2'].map((id) => load(id)));
    expect(settingsQueries).toHaveLength(1);
    expect(outcomes.map((o) => o.status)).toEqual(['fulfilled', 'rejected', 'fulfilled']);
    // The zone clock names the field it could not read.
    expect((outcomes[1] as PromiseRejectedResult).reason).toMatchObject({ field: 'timeZone' });
  });

  it('rejects the loads of a failed query and leaves the next batch to its own query', async () => {
    const systems = fleet(4);
    const { settings, readings } = fakes(systems, { failWhenAsked: 'system-1' });
    const load = createAnalyticsSettingsLoader({ settings, readings, now: () => START, batchLimit: 2 });
    const outcomes = await Promise.allSettled([...systems.keys()].map((id) => load(id)));
    expect(outcomes.map((o) => o.status)).toEqual(['rejected', 'rejected', 'fulfilled', 'fulfilled']);
    expect((outcomes[0] as PromiseRejectedResult).reason.message).toBe('connection terminated');
  });

  it('reads the settings as they are at each load: nothing is kept between loads', async () => {
    const systems = fleet(1);
    const { settings, readings, settingsQueries } = fakes(systems);
    const load = createAnalyticsSettingsLoader({ settings, readings, now: () => START });
    expect((await load('system-0'))?.name).toBe('Cabin 0');
    systems.set('system-0', settingsOf('Cabin 0 (renamed)'));
    expect((await load('system-0'))?.name).toBe('Cabin 0 (renamed)');
    expect(settingsQueries).toHaveLength(2);
  });
});

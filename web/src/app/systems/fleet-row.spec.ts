import type { SystemStatus, SystemSummary } from '@cellwarden/shared';
import { fleetSortValue, matchesSearch, toFleetRow } from './fleet-row';

const NOW = Date.UTC(2026, 11, 2, 6, 0, 0);
const system: SystemSummary = {
  id: 'van-1',
  name: 'Blue van',
  kind: 'van',
  chemistry: 'lifepo4',
  nominalVoltage: 12,
  ratedCapacityAh: 200,
  usableCapacityAh: 180,
  latestReading: {
    measuredAt: NOW - 30_000,
    receivedAt: NOW,
    voltage: 13.2,
    current: 2,
    temperature: 10,
    stateOfCharge: 70,
  },
};
const status = (flags: NonNullable<SystemStatus['derived']>['activeFlags']): SystemStatus => ({
  systemId: 'van-1',
  latestReading: system.latestReading,
  derived: {
    stateOfCharge: 64,
    stateOfChargeSource: 'estimated',
    hoursToEmpty: null,
    hoursToFull: null,
    meanCurrent: null,
    byMorning: null,
    activeFlags: flags,
  },
  activeAlerts: [],
});

describe('toFleetRow', () => {
  it('prefers the derived state of charge over the reported one', () =>
    expect(toFleetRow(system, status([]), NOW).stateOfCharge).toBe(64));

  it('ranks a critical flag above a warning and a silent system', () => {
    const critical = toFleetRow(
      system,
      status([{ kind: 'over-temperature', severity: 'critical', since: 1, peakValue: 55 }]),
      NOW,
    );
    const warning = toFleetRow(
      system,
      status([{ kind: 'low-charge', severity: 'warning', since: 1, peakValue: 20 }]),
      NOW,
    );
    const silent = toFleetRow(system, null, NOW + 10 * 60_000);
    expect([critical.attention, warning.attention, silent.attention]).toEqual([3, 2, 1]);
    expect(silent.silent).toBe(true);
    expect(critical.worst).toBe('critical');
  });

  it('describes the pack in trade terms', () =>
    expect(toFleetRow(system, null, NOW).description).toBe('12 V LiFePO4 · 180 Ah usable · van'));
});

describe('matchesSearch', () => {
  const row = toFleetRow(
    system,
    status([{ kind: 'low-charge', severity: 'warning', since: 1, peakValue: 20 }]),
    NOW,
  );
  it('finds a system by part of its name, ignoring case', () =>
    expect(matchesSearch(row, 'BLUE')).toBe(true));
  it('finds a system by the title of an active flag', () =>
    expect(matchesSearch(row, 'CHARGE IS LOW')).toBe(true));
  it('leaves out systems that do not match', () => expect(matchesSearch(row, 'cabin')).toBe(false));
});

describe('fleetSortValue', () => {
  it('sorts systems without a reading below every value', () =>
    expect(fleetSortValue(toFleetRow({ ...system, latestReading: null }, null, NOW), 'voltage')).toBe(
      -Infinity,
    ));
});

import type { ReceivedReading, SystemStatus, SystemSummary } from '@cellwarden/shared';
import { EMPTY_COPY, parseCopy, withLiveReading, withStatus, withSystems } from './offline-copy';

const reading = (measuredAt: number, voltage: number, stateOfCharge?: number): ReceivedReading => ({
  measuredAt,
  receivedAt: measuredAt + 200,
  voltage,
  current: -3,
  temperature: 12,
  ...(stateOfCharge === undefined ? {} : { stateOfCharge }),
});

const summary = (id: string, latestReading: ReceivedReading | null): SystemSummary => ({
  id,
  name: `System ${id}`,
  kind: 'van',
  chemistry: 'lifepo4',
  nominalVoltage: 12,
  ratedCapacityAh: 200,
  usableCapacityAh: 180,
  latestReading,
});

const status = (
  systemId: string,
  latestReading: ReceivedReading | null,
  soc: number | null,
): SystemStatus => ({
  systemId,
  latestReading,
  derived:
    soc === null
      ? null
      : {
          stateOfCharge: soc,
          stateOfChargeSource: 'estimated',
          hoursToEmpty: null,
          hoursToFull: null,
          meanCurrent: null,
          byMorning: null,
          activeFlags: [],
        },
  activeAlerts: [],
});

describe('the offline copy of the last values', () => {
  it('keeps the systems list as the server sent it, with the time it arrived', () => {
    const copy = withSystems(EMPTY_COPY, [summary('a', reading(1000, 13.1, 70)), summary('b', null)], 5000);
    expect(copy.savedAt).toBe(5000);
    expect(copy.systems.map((s) => [s.id, s.reading?.voltage ?? null, s.stateOfCharge])).toEqual([
      ['a', 13.1, 70],
      ['b', null, null],
    ]);
  });

  it('drops a system the list no longer holds (access ended)', () => {
    const before = withSystems(EMPTY_COPY, [summary('a', null), summary('b', null)], 1);
    expect(withSystems(before, [summary('b', null)], 2).systems.map((s) => s.id)).toEqual(['b']);
  });

  it("takes the status's own charge figure for a system already listed, and ignores one not listed", () => {
    const listed = withSystems(EMPTY_COPY, [summary('a', reading(1000, 13.1))], 1);
    const updated = withStatus(listed, status('a', reading(2000, 13.0), 64), 3);
    expect(updated.systems[0]).toMatchObject({ stateOfCharge: 64, reading: { voltage: 13.0 } });
    expect(withStatus(listed, status('zz', reading(2000, 12), 10), 3)).toBe(listed);
  });

  it('keeps a newer live reading when an older answer arrives after it', () => {
    const listed = withSystems(EMPTY_COPY, [summary('a', reading(1000, 13.1))], 1);
    const live = withLiveReading(listed, 'a', reading(9000, 12.6, 40), null, 9100);
    expect(live.systems[0]).toMatchObject({ stateOfCharge: 40, reading: { voltage: 12.6 } });
    const late = withStatus(live, status('a', reading(5000, 12.9), null), 9200);
    expect(late.systems[0].reading?.voltage).toBe(12.6);
    expect(withSystems(late, [summary('a', reading(5000, 12.9))], 9300).systems[0].reading?.voltage).toBe(
      12.6,
    );
  });

  it('reads anything not shaped like a copy as no copy', () => {
    expect(parseCopy(null)).toEqual(EMPTY_COPY);
    expect(parseCopy('{not json')).toEqual(EMPTY_COPY);
    expect(parseCopy('{"savedAt":"x","systems":[]}')).toEqual(EMPTY_COPY);
    expect(parseCopy(JSON.stringify({ savedAt: 4, systems: [] }))).toEqual({ savedAt: 4, systems: [] });
  });
});

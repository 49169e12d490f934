import type { MinuteSummary } from '@cellwarden/shared';
import { hourRollupOf } from './demo-battery-year';

const HOUR = Date.UTC(2026, 0, 14, 20);
const minute = (index: number, overrides: Partial<MinuteSummary> = {}): MinuteSummary => ({
  start: HOUR + index * 60_000,
  voltageMin: 13.0,
  voltageMax: 13.4,
  voltageLast: 13.2,
  currentMin: -5,
  currentMax: 10,
  currentMean: 2,
  temperatureMean: -1 + index,
  ahIn: 0.2,
  ahOut: 0.1,
  ...overrides,
});

describe('hourRollupOf', () => {
  it('fills every rollups_1h column from the hour’s minutes, one reading each', () => {
    const hour = hourRollupOf([
      minute(0, { socLast: 60, voltageMin: 12.9 }),
      minute(1, { currentMax: 30 }),
      minute(2, { socLast: 62, voltageLast: 13.3, currentMean: 4 }),
    ]);
    expect(hour).toMatchObject({
      start: HOUR,
      readingCount: 3,
      voltageMin: 12.9,
      voltageMax: 13.4,
      voltageLast: 13.3,
      currentMax: 30,
      currentSum: 8,
      currentLast: 4,
      temperatureMin: -1,
      temperatureMax: 1,
      temperatureSum: 0,
      temperatureLast: 1,
      socMin: 60,
      socMax: 62,
      socLast: 62,
      socSum: 122,
      socCount: 2,
      lastMinute: HOUR + 120_000,
    });
    expect(hour.voltageSum).toBeCloseTo(13.2 + 13.2 + 13.3, 9);
    expect(hour.ahIn).toBeCloseTo(0.6, 9);
    // Energy is shared/'s rule: each minute's amp-hours at its last voltage.
    expect(hour.whIn).toBeCloseTo(0.2 * 13.2 * 2 + 0.2 * 13.3, 9);
  });

  it('leaves the state of charge out when no minute reported one', () => {
    const hour = hourRollupOf([minute(0), minute(1)]);
    expect(hour.socCount).toBe(0);
    expect(hour.socSum).toBeNull();
    expect(hour.socLast).toBeUndefined();
  });
});

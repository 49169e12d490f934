import type { BatteryReading } from '../telemetry/reading';
import { resolveSystemAnalyticsSettings } from './derive-system-state';
import { flagEpisodes } from './flag-episodes';

const settings = resolveSystemAnalyticsSettings({
  battery: { chemistry: 'lifepo4', nominalVoltage: 12, ratedCapacityAh: 200, usableCapacityAh: 190 },
});

const series = (from: number, minutes: number, temperature: number, current: number): BatteryReading[] =>
  Array.from({ length: minutes * 6 }, (_, i) => ({
    measuredAt: from + i * 10_000,
    voltage: 13.3,
    current,
    temperature,
    stateOfCharge: 60,
  }));

describe('flagEpisodes', () => {
  it('finds a cold-charging episode that started and ended within the span', () => {
    const t0 = Date.UTC(2026, 11, 1, 2);
    // 20 minutes of 10 A into a −5 °C LiFePO4 pack (below its 0 °C limit, common practice), then 30 warm.
    const readings = [...series(t0, 20, -5, 10), ...series(t0 + 20 * 60_000, 30, 8, -2)];
    const episodes = flagEpisodes(readings, settings);
    expect(episodes.map((e) => e.kind)).toEqual(['cold-charging']);
    // It starts after the 30 s minimum duration and ends after the 15 min release delay once warm.
    expect(episodes[0].startedAt).toBe(t0 + 30_000);
    expect(episodes[0].endedAt).toBe(t0 + 35 * 60_000);
    expect(episodes[0].peak).toBe(-5);
  });

  it('leaves out an episode still open at the end of the span', () => {
    expect(flagEpisodes(series(Date.UTC(2026, 11, 1), 10, -5, 10), settings)).toEqual([]);
  });
});

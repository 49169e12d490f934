import { MinuteSummary } from './health-types';
import { hoursOf, rollUpHour } from './hour-rollup';

const T0 = Date.UTC(2026, 5, 1, 10);

function minute(i: number, current: number, temperature: number, soc?: number): MinuteSummary {
  return {
    start: T0 + i * 60_000,
    voltageMin: 13,
    voltageMax: 13,
    voltageLast: 13,
    currentMin: current,
    currentMax: current,
    currentMean: current,
    temperatureMean: temperature,
    ahIn: Math.max(0, current) / 60,
    ahOut: Math.max(0, -current) / 60,
    ...(soc === undefined ? {} : { socLast: soc }),
  };
}

describe('hour roll-up', () => {
  it('sums amp-hours, watt-hours and keeps the temperature and state-of-charge extremes', () => {
    const hour = rollUpHour([minute(0, 6, 10, 50), minute(1, -12, 14, 49), minute(2, 0, 12)]);
    expect(hour).toEqual({
      start: T0,
      ahIn: 0.1,
      ahOut: 0.2,
      whIn: 1.3,
      whOut: 2.6,
      temperatureMin: 10,
      temperatureMax: 14,
      temperatureMean: 12,
      socMin: 49,
      socMax: 50,
      socLast: 49,
      readingCount: 3,
    });
  });

  it('prefers the watt-hours a minute carries', () => {
    expect(rollUpHour([{ ...minute(0, 6, 10), whIn: 2 }]).whIn).toBe(2);
  });

  it('cuts a stream of minutes at clock hours', () => {
    const stream = Array.from({ length: 150 }, (_, i) => minute(i + 30, 1, 20));
    const hours = [...hoursOf(stream)];
    expect(hours.map((h) => [h.start - T0, h.readingCount])).toEqual([
      [0, 30],
      [3_600_000, 60],
      [7_200_000, 60],
    ]);
  });
});

import { BatteryReading } from '../telemetry/reading';
import { stepMeanCurrent } from './mean-current';

const at = (minutes: number, current: number): BatteryReading => ({
  measuredAt: Date.UTC(2026, 11, 2) + minutes * 60_000,
  voltage: 13.1,
  current,
  temperature: 20,
});

describe('stepMeanCurrent', () => {
  it('settles on a steady current', () => {
    let mean = stepMeanCurrent(undefined, at(0, -8));
    for (let m = 1; m <= 60; m++) mean = stepMeanCurrent(mean, at(m, -8), 30);
    expect(mean.meanCurrent).toBeCloseTo(-8, 9);
  });

  it('covers 63.2 % of a step change after one window, whatever the reading interval', () => {
    // First-order exponential response: 1 − e^(−t/τ) at t = τ is 63.2 % (general reference)
    const expected = -10 * (1 - Math.exp(-1));
    for (const stepSeconds of [1, 10, 60]) {
      let mean = stepMeanCurrent(undefined, at(0, 0));
      for (let s = stepSeconds; s <= 30 * 60; s += stepSeconds)
        mean = stepMeanCurrent(mean, at(s / 60, -10), 30);
      expect(mean.meanCurrent).toBeCloseTo(expected, 6);
    }
  });

  it('ignores a reading older than the last', () => {
    const mean = stepMeanCurrent(stepMeanCurrent(undefined, at(0, -5)), at(1, -5));
    expect(stepMeanCurrent(mean, at(0.5, 100))).toBe(mean);
  });
});

import { SCENARIOS } from './scenario';
import { simulateReadings } from './simulate-readings';

const options = { seed: 7, start: Date.UTC(2026, 0, 10, 18), intervalSeconds: 60, count: 12 * 60 };

describe('simulateReadings', () => {
  it('gives identical readings for the same seed', () => {
    expect(simulateReadings(SCENARIOS['frost-night'], options)).toEqual(
      simulateReadings(SCENARIOS['frost-night'], options),
    );
  });

  it('cools the frost-night pack below 0 °C while the unprotected charger keeps pushing current', () => {
    const { readings } = simulateReadings(SCENARIOS['frost-night'], options);
    const coldCharging = readings.filter((r) => r.temperature < 0 && r.current > 0);
    expect(coldCharging.length).toBeGreaterThan(0);
  });

  it('returns exactly count readings with their own measured times', () => {
    const { readings } = simulateReadings(SCENARIOS['driving-day'], { ...options, count: 5 });
    expect(readings.map((r) => r.measuredAt - options.start)).toEqual([0, 60e3, 120e3, 180e3, 240e3]);
  });
});

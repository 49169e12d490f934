import { ambientTemperature, stepThermal, ThermalConfig } from './thermal-model';

const config: ThermalConfig = {
  climate: { meanTemperature: -10, dailySwing: 6, coldestHour: 4 },
  packTimeConstantSeconds: 3 * 3600,
  cabinTimeConstantSeconds: 1800,
  heaterRise: 40,
  packInCabin: false,
};

describe('thermal model', () => {
  it('is coldest at the coldest hour and warmest twelve hours later', () => {
    expect(ambientTemperature(config.climate, Date.UTC(2026, 0, 10, 4), 0)).toBeCloseTo(-16, 9);
    expect(ambientTemperature(config.climate, Date.UTC(2026, 0, 10, 16), 0)).toBeCloseTo(-4, 9);
    // Local time runs an hour ahead per 15° east: 04:00 at 30° E is 02:00 UTC.
    expect(ambientTemperature(config.climate, Date.UTC(2026, 0, 10, 2), 30)).toBeCloseTo(-16, 9);
  });

  it('lets the pack close 63.2 % of the gap to ambient in one time constant', () => {
    // First-order lag: after one time constant 1 − e⁻¹ ≈ 63.2 % of a step is done (general reference).
    let state = { cabinTemperature: 20, packTemperature: 20 };
    for (let t = 0; t < 3 * 3600; t += 10) state = stepThermal(state, config, -10, false, 10);
    expect(state.packTemperature).toBeCloseTo(20 - 30 * (1 - Math.exp(-1)), 6);
  });

  it('warms a pack inside the living space while the heater runs', () => {
    const inside = { ...config, packInCabin: true };
    let heated = { cabinTemperature: 0, packTemperature: 0 };
    let unheated = heated;
    for (let t = 0; t < 2 * 3600; t += 10) {
      heated = stepThermal(heated, inside, -10, true, 10);
      unheated = stepThermal(unheated, inside, -10, false, 10);
    }
    expect(heated.cabinTemperature).toBeGreaterThan(20);
    expect(heated.packTemperature).toBeGreaterThan(0);
    expect(unheated.packTemperature).toBeLessThan(0);
  });
});

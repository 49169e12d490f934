import { airMass, clearSkyHorizontalIrradiance, solarArrayWatts } from './solar-array';

describe('solar array', () => {
  it('gives the air mass of the sun overhead and at 30° elevation', () => {
    // Kasten & Young (1989) via PVEducation "Air Mass": AM ≈ 1 overhead, ≈ 2 (1/cos 60°) at zenith 60°.
    expect(airMass(90)).toBeCloseTo(1, 2);
    expect(airMass(30)).toBeCloseTo(2, 1);
  });

  it('gives about 1040 W/m² global irradiance with the sun overhead', () => {
    // PVEducation "Air Mass": direct 1.353 · 0.7^(1^0.678) = 0.947 kW/m², global ≈ 1.1 × direct ≈ 1.04 kW/m².
    expect(clearSkyHorizontalIrradiance(90)).toBeCloseTo(1042, -1);
    expect(clearSkyHorizontalIrradiance(-1)).toBe(0);
  });

  it('produces nothing at night and most at midday', () => {
    const array = { peakWatts: 200, derating: 0.8, clearness: 1 };
    expect(solarArrayWatts(array, 47, 8, Date.UTC(2026, 5, 21, 0))).toBe(0);
    const noon = solarArrayWatts(array, 47, 8, Date.UTC(2026, 5, 21, 11, 30));
    expect(noon).toBeGreaterThan(solarArrayWatts(array, 47, 8, Date.UTC(2026, 5, 21, 7)));
    expect(noon).toBeLessThan(200);
  });
});

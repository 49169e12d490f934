import { solarElevation, solarNoon, sunrise } from './solar-position';

const MINUTE = 60_000;

describe('solar position (suncalc)', () => {
  it('rises over London at 03:43 UTC on the June solstice, with the sun 0.833° below the horizon', () => {
    // Published sunrise for London on 21 June: 04:43 BST = 03:43 UTC (timeanddate.com / USNO tables, from memory)
    const rise = sunrise(Date.UTC(2026, 5, 21), 51.5074, -0.1278) as number;
    expect(Math.abs(rise - Date.UTC(2026, 5, 21, 3, 43))).toBeLessThan(2 * MINUTE);
    // USNO convention: sunrise when the upper limb touches the horizon, apparent centre at −0.833° (refraction
    // 34′ and semi-diameter 16′); suncalc returns apparent altitude, so the centre reads about −0.27° there
    expect(solarElevation(51.5074, -0.1278, rise)).toBeGreaterThan(-0.9);
    expect(solarElevation(51.5074, -0.1278, rise)).toBeLessThan(0);
  });

  it('puts solar noon at Greenwich by the equation of time at its extremes', () => {
    // Wikipedia "Equation of time" (secondary): sundial ≈ 16 min 33 s fast around 3 November, ≈ 14 min 6 s
    // slow around 11 February → transit at about 11:43:30 and 12:14:10 UTC on the prime meridian
    expect(Math.abs(solarNoon(Date.UTC(2026, 10, 3), 0) - Date.UTC(2026, 10, 3, 11, 43, 30))).toBeLessThan(
      MINUTE,
    );
    expect(Math.abs(solarNoon(Date.UTC(2026, 1, 11), 0) - Date.UTC(2026, 1, 11, 12, 14, 10))).toBeLessThan(
      MINUTE,
    );
  });

  it.each([
    // Noon elevation = 90° − |φ − δ| with δ = +23.44° at the June solstice (Wikipedia "Axial tilt") and
    // δ ≈ 0 at the March equinox of 20 March 2026 (general reference), plus a few hundredths of refraction
    [52, 10, Date.UTC(2026, 5, 21), 90 - 52 + 23.44],
    [-33.9, 18.4, Date.UTC(2026, 5, 21), 90 - 33.9 - 23.44],
    [0, 0, Date.UTC(2026, 2, 20), 90],
  ])('reaches the published noon elevation (lat %p)', (latitude, longitude, day, expected) => {
    const noon = solarNoon(day, longitude);
    expect(Math.abs(solarElevation(latitude, longitude, noon) - expected)).toBeLessThan(0.3);
    expect(solarElevation(latitude, longitude, noon - 3600_000)).toBeLessThan(
      solarElevation(latitude, longitude, noon),
    );
  });

  it('has no sunrise in the polar night', () => {
    // Svalbard (78.2° N) has polar night around the December solstice (general reference)
    expect(sunrise(Date.UTC(2026, 11, 21), 78.2, 15.6)).toBeUndefined();
  });
});

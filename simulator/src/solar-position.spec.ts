import {
  equationOfTimeMinutes,
  solarDeclination,
  solarElevation,
  solarNoon,
  sunrise,
} from './solar-position';

describe('solar position (NOAA general solar position calculations)', () => {
  it('puts the sun over the tropics at the solstices and the equator at the equinox', () => {
    // Axial tilt 23.44° (Wikipedia "Axial tilt"); declination ≈ 0 at the March equinox (general reference).
    expect(solarDeclination(Date.UTC(2026, 5, 21, 12))).toBeCloseTo(23.44, 0);
    expect(solarDeclination(Date.UTC(2026, 11, 21, 12))).toBeCloseTo(-23.44, 0);
    expect(Math.abs(solarDeclination(Date.UTC(2026, 2, 20, 12)))).toBeLessThan(0.6);
  });

  it('gives the equation of time at its extremes', () => {
    // Wikipedia "Equation of time": sundial about 16 min 33 s fast around 3 November, 14 min 6 s slow
    // around 11 February. Spencer's series is good to about half a minute.
    expect(equationOfTimeMinutes(Date.UTC(2026, 10, 3, 12))).toBeCloseTo(16.5, 0);
    expect(equationOfTimeMinutes(Date.UTC(2026, 1, 11, 12))).toBeCloseTo(-14.1, 0);
  });

  it.each([
    [52, 10, Date.UTC(2026, 5, 21)],
    [-33.9, 18.4, Date.UTC(2026, 5, 21)],
    [61.5, 23.8, Date.UTC(2026, 0, 10)],
  ])('reaches 90° − |latitude − declination| at solar noon (lat %p)', (latitude, longitude, day) => {
    const noon = solarNoon(day, longitude);
    // Noon elevation = 90° − |φ − δ| (general reference).
    expect(solarElevation(latitude, longitude, noon)).toBeCloseTo(
      90 - Math.abs(latitude - solarDeclination(noon)),
      2,
    );
    expect(solarElevation(latitude, longitude, noon - 3600_000)).toBeLessThan(
      solarElevation(latitude, longitude, noon),
    );
  });

  it('rises over London at 03:43 UTC on the June solstice', () => {
    // Published sunrise for London on 21 June: 04:43 BST = 03:43 UTC (timeanddate.com, from memory).
    const rise = sunrise(Date.UTC(2026, 5, 21), 51.5074, -0.1278) as number;
    expect(Math.abs(rise - Date.UTC(2026, 5, 21, 3, 43))).toBeLessThan(3 * 60_000);
    // NOAA's sunrise is the moment the centre is 0.833° below the horizon (refraction and the sun's radius).
    expect(solarElevation(51.5074, -0.1278, rise)).toBeCloseTo(-0.833, 1);
  });

  it('has no sunrise in the polar night', () => {
    expect(sunrise(Date.UTC(2026, 11, 21), 78.2, 15.6)).toBeUndefined();
  });
});

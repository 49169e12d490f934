// Sun position from the `suncalc` package (v2: Meeus's solar series with ΔT, apparent altitude with
// refraction), rather than a hand-written Spencer series, which is off by up to ~0.5° and minutes at sunrise.
import { getPosition, getTimes } from 'suncalc';

const DAY_MS = 86_400_000;

/** Apparent elevation of the sun's centre above the horizon, degrees (refraction included). */
export function solarElevation(latitude: number, longitude: number, at: number): number {
  return getPosition(new Date(at), latitude, longitude).altitude;
}

/** UTC time of solar noon (the sun's transit) on the UTC day containing `at`, ms. */
export function solarNoon(at: number, longitude: number): number {
  return getTimes(nearNoon(at, longitude), 0, longitude).solarNoon.getTime();
}

/** UTC time of sunrise (upper limb on the horizon, −0.833°) on the UTC day containing `at`, ms; undefined in polar day or night. */
export function sunrise(at: number, latitude: number, longitude: number): number | undefined {
  return getTimes(nearNoon(at, longitude), latitude, longitude).sunrise?.getTime();
}

// suncalc picks the solar day whose transit is nearest the instant given; the local mean noon of the UTC day
// names that day without ambiguity at any longitude.
function nearNoon(at: number, longitude: number): Date {
  return new Date(Math.floor(at / DAY_MS) * DAY_MS + DAY_MS / 2 - longitude * 4 * 60_000);
}

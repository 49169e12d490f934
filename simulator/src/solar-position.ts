// Sun position from NOAA Global Monitoring Laboratory, "General Solar Position Calculations": the fractional
// year γ, Spencer's (1971) Fourier series for the equation of time and the declination, the hour angle from
// true solar time, and cos(zenith) = sin φ sin δ + cos φ cos δ cos h.

const DEG = Math.PI / 180;
const DAY_MS = 86_400_000;

/** Fractional year γ in radians at a UTC time (NOAA: 2π/365 · (day of year − 1 + (hour − 12)/24)). */
export function fractionalYear(at: number): number {
  const date = new Date(at);
  const yearStart = Date.UTC(date.getUTCFullYear(), 0, 1);
  const year = date.getUTCFullYear();
  const daysInYear = (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0 ? 366 : 365;
  const dayOfYear = Math.floor((at - yearStart) / DAY_MS) + 1;
  const hour = date.getUTCHours() + date.getUTCMinutes() / 60 + date.getUTCSeconds() / 3600;
  return ((2 * Math.PI) / daysInYear) * (dayOfYear - 1 + (hour - 12) / 24);
}

/** Equation of time, minutes (apparent minus mean solar time), Spencer's series as NOAA gives it. */
export function equationOfTimeMinutes(at: number): number {
  const g = fractionalYear(at);
  return (
    229.18 *
    (0.000075 +
      0.001868 * Math.cos(g) -
      0.032077 * Math.sin(g) -
      0.014615 * Math.cos(2 * g) -
      0.040849 * Math.sin(2 * g))
  );
}

/** Solar declination, degrees, Spencer's series as NOAA gives it. */
export function solarDeclination(at: number): number {
  const g = fractionalYear(at);
  const radians =
    0.006918 -
    0.399912 * Math.cos(g) +
    0.070257 * Math.sin(g) -
    0.006758 * Math.cos(2 * g) +
    0.000907 * Math.sin(2 * g) -
    0.002697 * Math.cos(3 * g) +
    0.00148 * Math.sin(3 * g);
  return radians / DEG;
}

/** Solar hour angle, degrees (0 at solar noon, negative in the morning), for a longitude east-positive. */
export function hourAngle(at: number, longitude: number): number {
  const minutesOfDay = (((at % DAY_MS) + DAY_MS) % DAY_MS) / 60_000;
  const trueSolarMinutes = minutesOfDay + equationOfTimeMinutes(at) + 4 * longitude;
  return trueSolarMinutes / 4 - 180;
}

/** Elevation of the sun's centre above the horizon, degrees, without refraction. */
export function solarElevation(latitude: number, longitude: number, at: number): number {
  const phi = latitude * DEG;
  const delta = solarDeclination(at) * DEG;
  const h = hourAngle(at, longitude) * DEG;
  const cosZenith = Math.sin(phi) * Math.sin(delta) + Math.cos(phi) * Math.cos(delta) * Math.cos(h);
  return 90 - Math.acos(Math.min(1, Math.max(-1, cosZenith))) / DEG;
}

/** UTC time of solar noon on the UTC day containing `at`, ms (NOAA: 720 − 4·longitude − eqtime minutes). */
export function solarNoon(at: number, longitude: number): number {
  const midnight = Math.floor(at / DAY_MS) * DAY_MS;
  const minutes = 720 - 4 * longitude - equationOfTimeMinutes(midnight + DAY_MS / 2);
  return midnight + minutes * 60_000;
}

/** UTC time of sunrise on the UTC day containing `at`, ms, or undefined in polar day or night. */
export function sunrise(at: number, latitude: number, longitude: number): number | undefined {
  const noon = solarNoon(at, longitude);
  const phi = latitude * DEG;
  const delta = solarDeclination(noon) * DEG;
  // NOAA: zenith 90.833° allows for refraction and the sun's radius.
  const cosH = Math.cos(90.833 * DEG) / (Math.cos(phi) * Math.cos(delta)) - Math.tan(phi) * Math.tan(delta);
  if (cosH < -1 || cosH > 1) return undefined;
  return noon - (Math.acos(cosH) / DEG) * 4 * 60_000;
}

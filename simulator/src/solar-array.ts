import { solarElevation } from './solar-position';

/** A flat roof array (horizontal panels) feeding an MPPT controller. */
export interface SolarArray {
  /** Rated panel power at standard test conditions (1000 W/m²), W. */
  peakWatts: number;
  /** Fraction of the clear-sky output after wiring, heat and dirt losses (0.75–0.85, common practice). */
  derating: number;
  /** Fraction of clear-sky irradiance the weather lets through (1 = clear). */
  clearness: number;
}

const DEG = Math.PI / 180;

/** Relative air mass at an elevation (Kasten & Young 1989, as given by PVEducation "Air Mass"). */
export function airMass(elevation: number): number {
  const zenith = 90 - elevation;
  return 1 / (Math.cos(zenith * DEG) + 0.50572 * Math.pow(96.07995 - zenith, -1.6364));
}

/** Clear-sky global irradiance on a horizontal surface, W/m². */
export function clearSkyHorizontalIrradiance(elevation: number): number {
  if (elevation <= 0) return 0;
  // Direct beam 1353 · 0.7^(AM^0.678) W/m² (Meinel & Meinel 1976), plus ~10 % diffuse, both as given by
  // PVEducation "Air Mass"; projected onto a horizontal panel by sin(elevation).
  const direct = 1353 * Math.pow(0.7, Math.pow(airMass(elevation), 0.678));
  return 1.1 * direct * Math.sin(elevation * DEG);
}

/** Power the array can deliver at a time and place, W. */
export function solarArrayWatts(array: SolarArray, latitude: number, longitude: number, at: number): number {
  const irradiance = clearSkyHorizontalIrradiance(solarElevation(latitude, longitude, at));
  return array.peakWatts * (irradiance / 1000) * array.derating * array.clearness;
}

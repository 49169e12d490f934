import { DailyWindow, withinWindows } from './local-time';
import { SolarArray, solarArrayWatts } from './solar-array';

/** Kinds of charge source a system may have. */
export type ChargeSourceKind = 'dcdc' | 'solar' | 'shore';

/** One charge source: its id in readings (`sourceCurrents`), rating, wiring and when it has input. */
export interface ChargeSourceConfig {
  id: string;
  kind: ChargeSourceKind;
  /** Rated output current, A. */
  ratedCurrent: number;
  /** Resistance of the cable pair to the battery, Ω (copper: 0.0172 Ω·mm²/m × round-trip length / area). */
  cableResistance: number;
  /** When the alternator runs (dcdc) or shore power is plugged in (shore); solar follows the sun. */
  schedule?: readonly DailyWindow[];
  /** The panels behind a solar controller. */
  array?: SolarArray;
}

/** Where the system is, for the sun. */
export interface Location {
  latitude: number;
  longitude: number;
}

/** Resistance of a copper cable pair, Ω: ρ·2L/A with ρ = 0.0172 Ω·mm²/m at 20 °C (general reference). */
export function copperPairResistance(oneWayMetres: number, areaSquareMm: number): number {
  return (0.0172 * 2 * oneWayMetres) / areaSquareMm;
}

/** Current the source's input could supply into the battery now, A (before its rating and charge stage). */
export function availableCurrent(
  source: ChargeSourceConfig,
  location: Location,
  at: number,
  hour: number,
  batteryVoltage: number,
): number {
  if (source.kind === 'solar') {
    if (!source.array) return 0;
    // An MPPT controller converts panel power to battery current at the battery voltage.
    return solarArrayWatts(source.array, location.latitude, location.longitude, at) / batteryVoltage;
  }
  return withinWindows(source.schedule ?? [], hour) ? Number.POSITIVE_INFINITY : 0;
}

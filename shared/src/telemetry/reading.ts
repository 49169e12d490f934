/** One measurement of a battery pack at one instant, in SI-style trade units. */
export interface BatteryReading {
  /** When the device measured it (not when it arrived), milliseconds since the Unix epoch. */
  measuredAt: number;
  /** Pack terminal voltage, volts. */
  voltage: number;
  /** Pack current, amperes; positive flows into the battery (charging), negative out of it. */
  current: number;
  /** Pack temperature, degrees Celsius. */
  temperature: number;
  /** State of charge reported by the device, percent (0–100); absent when the device reports none. */
  stateOfCharge?: number;
  /** Power at the pack terminals, watts (positive = charging); absent when not reported. */
  power?: number;
  /** Current from each charge source, amperes, keyed by the source's id (e.g. `dcdc`, `solar`, `shore`). */
  sourceCurrents?: Record<string, number>;
}

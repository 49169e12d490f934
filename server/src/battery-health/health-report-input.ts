import type { CapacitySample, CapacityTrend, LifeCycleFigures } from '@cellwarden/shared';

/** Everything a battery health report (PDF or CSV) shows; plain data, so it can cross to a worker thread. */
export interface HealthReportInput {
  system: {
    name: string;
    kind: string;
    chemistry: string;
    nominalVoltage: number;
    ratedCapacityAh: number;
    usableCapacityAh: number;
  };
  /** IANA time zone every date of the report is written in. */
  timeZone: string;
  /** The period asked for, ms. */
  requested: { from: number; to: number };
  /** The hours with data inside it; null when there were none. */
  covered: { from: number; to: number } | null;
  madeAt: number;
  trend: CapacityTrend;
  samples: CapacitySample[];
  figures: LifeCycleFigures;
  words: string[];
  method: string;
  /** The unit every temperature is written in (the reader's preference). */
  unit: TemperatureUnitCode;
}

/** °C or °F. */
export type TemperatureUnitCode = 'C' | 'F';

// The data shapes of battery health: what the capacity estimator and the life-cycle accumulator read (the
// per-minute and per-hour rollups), what they produce, and the JSON state the server persists between runs.

/** One minute of a battery's life as the per-minute rollups store it (rollups_1m): the estimator's input. */
export interface MinuteSummary {
  /** Start of the minute, ms since the epoch. */
  start: number;
  voltageMin: number;
  voltageMax: number;
  voltageLast: number;
  currentMin: number;
  currentMax: number;
  /** Mean current over the minute, A (+ = into the battery). */
  currentMean: number;
  /** Mean pack temperature, °C. */
  temperatureMean: number;
  /** Amp-hours counted into the battery in this minute. */
  ahIn: number;
  /** Amp-hours counted out of the battery in this minute. */
  ahOut: number;
  /** State of charge the device itself reported last in the minute, %. */
  socLast?: number;
  /** Watt-hours into and out of the battery in this minute, when the rollup keeps them. */
  whIn?: number;
  whOut?: number;
}

/** How a capacity sample learned the state of charge at its end. */
export type CapacitySampleMethod = 'rested-ocv' | 'low-voltage-cutoff';

/** One capacity measurement: amp-hours counted between a full-charge sync and a later point of known state of charge. */
export interface CapacitySample {
  /** End of the measurement (the rested or cut-off minute), ms. */
  at: number;
  /** The full-charge sync the count started from, ms. */
  fullAt: number;
  /** Usable capacity at 25 °C in the owner's terms (same scale as the setup's usableCapacityAh), Ah. */
  usableAh: number;
  /** One standard deviation of `usableAh`, Ah. */
  sigmaAh: number;
  /** Net amp-hours taken out between full and the end (discharge − stored charge), Ah. */
  countedAh: number;
  /** State of charge at the end, fraction 0–1 of the whole open-circuit scale. */
  socAtEnd: number;
  method: CapacitySampleMethod;
  /** Pack temperature at the end, °C. */
  temperature: number;
}

/** What the capacity tracker remembers between minutes: plain JSON, persisted per battery by the server. */
export type CapacityTrackerState = {
  /** Layout version of this state, so a future change can refuse or migrate an old one. */
  version: 1;
  /** Start of the last minute taken into account, ms. */
  lastMinuteStart?: number;
  /** Since when the bank has sat at the charged voltage with a tail current, ms. */
  chargedSince?: number;
  /** The last full-charge sync, ms; undefined until the first one (or after a gap broke the count). */
  fullAt?: number;
  /** Net amp-hours drawn since the full-charge sync (Peukert-corrected discharge − stored charge). */
  countedAh: number;
  /** Charge amp-hours put in since the sync (their efficiency is uncertain), Ah. */
  chargeAhSinceFull: number;
  /** Since when the current has stayed near zero, ms. */
  restingSince?: number;
  /** Whether the present rest (or cut-off) already gave a sample. */
  sampledThisRest: boolean;
  /** Whether a discharge since the last quiet minute pulled the voltage to the low-voltage cut-off. */
  cutoffSeen: boolean;
  /** Relative uncertainty of the best sample taken since the sync: a later one must beat it. */
  bestRelativeSigma?: number;
};

/** Capacity over months, and the present estimate with its uncertainty. */
export interface CapacityTrend {
  months: { monthStart: number; usableAh: number; sigmaAh: number; samples: number }[];
  current?: {
    usableAh: number;
    sigmaAh: number;
    /** Estimate ÷ rated usable capacity (0..1, can exceed 1 for a new pack). */
    stateOfHealth: number;
    sigmaStateOfHealth: number;
    asOf: number;
  };
}

/** One hour as rollups_1h stores it: the life-cycle accumulator's input. */
export interface HourSummary {
  /** Start of the hour, ms. */
  start: number;
  ahIn: number;
  ahOut: number;
  whIn: number;
  whOut: number;
  temperatureMin: number;
  temperatureMax: number;
  temperatureMean: number;
  socMin?: number;
  socMax?: number;
  socLast?: number;
  /** Readings that went into the hour; 0 means the hour holds no data. */
  readingCount: number;
}

/** Temperature bands the life-cycle figures count hours in, °C. */
export type TemperatureBand = 'below-0' | '0-10' | '10-35' | '35-45' | 'above-45';

/** A run of consecutive hours of charging outside the safe temperature window. */
export interface ChargeEpisode {
  start: number;
  end: number;
  ahIn: number;
  lowestTemperature: number;
  highestTemperature: number;
}

/** Everything the health screen and report show about how a battery has been used. */
export interface LifeCycleFigures {
  /** Amp-hours discharged ÷ usable capacity. */
  equivalentFullCycles: number;
  ahIn: number;
  ahOut: number;
  whIn: number;
  whOut: number;
  /** Round-trip energy efficiency, Wh out ÷ Wh in between the first and the last full charge; undefined until two. */
  chargeEfficiency?: number;
  /** Depth-of-discharge histogram, rainflow-counted cycles (half cycles count 0.5) per 10 % band. */
  depthOfDischarge: { fromPercent: number; toPercent: number; cycles: number }[];
  temperatureHours: { band: TemperatureBand; hours: number }[];
  /** Hours at state of charge ≥ 90 % with a mean temperature ≥ 35 °C. */
  hotAtHighChargeHours: number;
  coldCharging: ChargeEpisode[];
  hotCharging: ChargeEpisode[];
  /** Hours with data taken into account. */
  hoursCovered: number;
}

/** What the life-cycle accumulator remembers: plain JSON, persisted per battery by the server. */
export type LifeCycleState = {
  version: 1;
  usableAh: number;
  lastHourStart?: number;
  hoursCovered: number;
  ahIn: number;
  ahOut: number;
  whIn: number;
  whOut: number;
  /** Wh in and out between the first and the last full charge seen, and since the last one. */
  wholeCycleWhIn: number;
  wholeCycleWhOut: number;
  pendingWhIn: number;
  pendingWhOut: number;
  seenFull: boolean;
  /** Rainflow stack of state-of-charge reversals, %, the last one still provisional. */
  reversals: number[];
  /** Closed (rainflow-counted) cycles per 10 % depth band, index 0 = 0–10 %. */
  closedCycles: number[];
  temperatureHours: Record<TemperatureBand, number>;
  hotAtHighChargeHours: number;
  coldCharging: ChargeEpisode[];
  hotCharging: ChargeEpisode[];
};

// One rule per flag kind: from a reading, the estimate and the system's settings, where the watched value
// stands against its start and release thresholds. Rules are pure and stateless; trends and previous
// readings come in through `memory`, and the tracker adds hysteresis timing and minimum durations.
import { chargeVoltageCompensation } from '../battery/battery-math';
import { CHEMISTRY_PROFILES } from '../battery/chemistry-profile';
import { BatteryReading } from '../telemetry/reading';
import { packInternalResistance } from './battery-setup';
import { FlagKind } from './flag-event';
import { FlagMemory, FlagSettings } from './flag-settings';
import { FlagSignal } from './flag-tracker';

/** Everything a rule may look at. */
export interface FlagContext {
  reading: BatteryReading;
  estimate: { stateOfCharge: number; disagreement?: number };
  settings: FlagSettings;
  memory: FlagMemory;
}

/** A flag rule. */
export type FlagRule = (context: FlagContext) => FlagSignal;

/** Longest time-to-limit reported, minutes; "a day or more" when the trend is flat or warming. */
const MAX_MINUTES_AHEAD = 1440;

/** Terminal voltage with the load's sag through the internal resistance added back (V + |I|·R). */
export function loadCompensatedVoltage(reading: BatteryReading, settings: FlagSettings): number {
  if (reading.current >= 0) return reading.voltage;
  return reading.voltage - reading.current * packInternalResistance(settings.battery);
}

const lowCharge: FlagRule = ({ estimate, settings }) => {
  const t = settings.thresholds;
  const value = estimate.stateOfCharge;
  return {
    trigger: belowLevels(value, t.lowChargeWarningPercent, t.lowChargeCriticalPercent),
    holds: value < t.lowChargeWarningPercent + t.lowChargeReleasePoints,
    value,
    unit: '%',
    worse: 'low',
  };
};

const lowVoltage: FlagRule = ({ reading, settings }) => {
  const t = settings.thresholds;
  const value = loadCompensatedVoltage(reading, settings);
  return {
    trigger: belowLevels(value, t.lowVoltageWarningV, t.lowVoltageCriticalV),
    holds: value < t.lowVoltageWarningV + t.lowVoltageReleaseV,
    value,
    unit: 'V',
    worse: 'low',
  };
};

const coldCharging: FlagRule = ({ reading, settings }) => {
  const t = settings.thresholds;
  const value = reading.temperature;
  const charging = reading.current > t.chargeFlowingA;
  return {
    trigger: charging && value < t.minimumChargeTemperatureC ? 'critical' : undefined,
    // One degree of warming or the charge all but stopping ends it; a dithering sensor does not.
    holds: reading.current > t.chargeFlowingA / 2 && value < t.minimumChargeTemperatureC + 1,
    value,
    unit: '°C',
    worse: 'low',
  };
};

const coldChargeAhead: FlagRule = ({ reading, settings, memory }) => {
  const t = settings.thresholds;
  const trend = memory.temperatureTrendCPerHour ?? 0;
  const margin = reading.temperature - t.minimumChargeTemperatureC;
  const value =
    margin >= 0 && trend < 0 ? Math.min(MAX_MINUTES_AHEAD, (margin / -trend) * 60) : MAX_MINUTES_AHEAD;
  const charging = reading.current > t.chargeFlowingA;
  return {
    trigger: charging && margin >= 0 && value <= t.coldChargeAheadMinutes ? 'warning' : undefined,
    holds:
      reading.current > t.chargeFlowingA / 2 && margin >= 0 && value <= (t.coldChargeAheadMinutes * 4) / 3,
    value,
    unit: 'min',
    worse: 'low',
  };
};

// Hot charging: charge flowing while the pack is above the chemistry's charge limit (LiFePO4 ≈ 45 °C).
const hotCharging: FlagRule = ({ reading, settings }) => {
  const t = settings.thresholds;
  const limit = t.maximumChargeTemperatureC;
  const value = reading.temperature;
  const charging = reading.current > t.chargeFlowingA;
  return {
    trigger: limit === undefined || !charging ? undefined : aboveLevels(value, limit, limit + 5, true),
    // A degree of cooling or the charge all but stopping ends it.
    holds: limit !== undefined && reading.current > t.chargeFlowingA / 2 && value > limit - 1,
    value,
    unit: '°C',
    worse: 'high',
  };
};

// Cold charge current: above the minimum charge temperature but in the band where cell makers cut the
// current, the charge current exceeds the reduced rate. The value watched is the current.
const coldChargeCurrent: FlagRule = ({ reading, settings }) => {
  const t = settings.thresholds;
  const below = t.reducedChargeBelowC;
  const limit = t.reducedChargeCurrentA;
  const value = Math.max(0, reading.current);
  const inBand =
    below !== undefined && reading.temperature >= t.minimumChargeTemperatureC && reading.temperature < below;
  return {
    trigger: inBand && limit !== undefined && value > limit ? 'warning' : undefined,
    holds:
      below !== undefined &&
      limit !== undefined &&
      reading.temperature >= t.minimumChargeTemperatureC &&
      reading.temperature < below + 1 &&
      value > limit * 0.9,
    value,
    unit: 'A',
    worse: 'high',
  };
};

const overTemperature: FlagRule = ({ reading, settings }) => {
  const t = settings.thresholds;
  const value = reading.temperature;
  return {
    trigger: aboveLevels(value, t.overTemperatureWarningC, t.overTemperatureCriticalC),
    holds: value > t.overTemperatureWarningC - t.overTemperatureReleaseC,
    value,
    unit: '°C',
    worse: 'high',
  };
};

const overDischarge: FlagRule = ({ reading, settings }) => {
  const rating = settings.thresholds.bmsContinuousCurrentA;
  const value = Math.max(0, -reading.current);
  return {
    trigger: aboveLevels(value, rating, rating * 1.5, true),
    holds: value > rating * 0.9,
    value,
    unit: 'A',
    worse: 'high',
  };
};

const bmsCutoffSuspected: FlagRule = ({ reading, settings, memory }) => {
  const t = settings.thresholds;
  // A 12 V bank never rests below about 10 V; a quarter of nominal means the pack is disconnected.
  const voltageCollapsed = reading.voltage < settings.battery.nominalVoltage * 0.25;
  const idle = Math.abs(reading.current) <= t.chargeFlowingA;
  const before = memory.previous;
  // Switching a load off also drops the current to zero; only a drop from a stressed pack is suspicious.
  const stressedBefore =
    before !== undefined &&
    -before.current >= t.demandCurrentA &&
    (before.compensatedVoltage <= t.lowVoltageWarningV ||
      -before.current >= t.bmsContinuousCurrentA ||
      before.temperature >= t.overTemperatureCriticalC);
  return {
    trigger: voltageCollapsed || (idle && stressedBefore) ? 'critical' : undefined,
    holds: voltageCollapsed || idle,
    value: reading.voltage,
    unit: 'V',
    worse: 'low',
  };
};

// Above this state of charge a charger is expected to taper (absorption, float), so a low current is no fault.
const BULK_CEILING_PERCENT = 90;

const chargerUnderDelivering: FlagRule = ({ reading, settings, estimate }) => {
  const t = settings.thresholds;
  const blocks = settings.battery.nominalVoltage / 12;
  const { chemistry, nominalVoltage } = settings.battery;
  // A compensating charger absorbs a hot lead-acid bank lower, so the bulk ceiling follows the temperature.
  const absorption =
    (CHEMISTRY_PROFILES[chemistry].absorptionVoltage - 0.3) * blocks +
    chargeVoltageCompensation(chemistry, nominalVoltage, reading.temperature);
  const bulk = estimate.stateOfCharge < BULK_CEILING_PERCENT && reading.voltage < absorption;
  const worst = weakestSource(reading, settings);
  const fraction = worst?.fraction ?? 1;
  return {
    trigger: bulk && fraction < t.underDeliveryFraction ? 'warning' : undefined,
    holds: bulk && fraction < t.underDeliveryFraction + 0.1,
    value: fraction * 100,
    unit: '%',
    worse: 'low',
    ...(worst === undefined ? {} : { sourceId: worst.id }),
  };
};

const socDisagreement: FlagRule = ({ estimate, settings }) => {
  const limit = settings.thresholds.socDisagreementPoints;
  const value = estimate.disagreement ?? 0;
  return {
    trigger: estimate.disagreement !== undefined && value > limit ? 'warning' : undefined,
    holds: estimate.disagreement !== undefined && value > (limit * 2) / 3,
    value,
    unit: '%',
    worse: 'high',
  };
};

/** The rule for each kind judged on a reading (device silence is judged by the clock, circuit ratings by the install register). */
export const FLAG_RULES: Readonly<
  Record<Exclude<FlagKind, 'device-silent' | 'circuit-near-rating'>, FlagRule>
> = {
  'low-charge': lowCharge,
  'low-voltage': lowVoltage,
  'cold-charging': coldCharging,
  'cold-charge-ahead': coldChargeAhead,
  'hot-charging': hotCharging,
  'cold-charge-current': coldChargeCurrent,
  'over-temperature': overTemperature,
  'over-discharge': overDischarge,
  'bms-cutoff-suspected': bmsCutoffSuspected,
  'charger-under-delivering': chargerUnderDelivering,
  'soc-disagreement': socDisagreement,
};

// Solar is never judged: the sky, not the controller, sets its output.
/** The charging source (not solar) delivering the smallest fraction of its rating, among those switched on. */
function weakestSource(
  reading: BatteryReading,
  settings: FlagSettings,
): { id: string; fraction: number } | undefined {
  let weakest: { id: string; fraction: number } | undefined;
  for (const source of settings.sources ?? []) {
    const current = reading.sourceCurrents?.[source.id];
    // A source reading zero is switched off (engine stopped, no shore power), not under-delivering.
    if (source.kind === 'solar' || current === undefined || current <= settings.thresholds.chargeFlowingA)
      continue;
    if (!(source.ratedCurrentA > 0)) continue;
    const fraction = current / source.ratedCurrentA;
    if (weakest === undefined || fraction < weakest.fraction) weakest = { id: source.id, fraction };
  }
  return weakest;
}

function belowLevels(value: number, warning: number, critical: number): FlagSignal['trigger'] {
  if (value < critical) return 'critical';
  return value < warning ? 'warning' : undefined;
}

function aboveLevels(
  value: number,
  warning: number,
  critical: number,
  strict = false,
): FlagSignal['trigger'] {
  // Plain comparisons, no closure: this runs for several rules on every reading of every system.
  if (strict ? value > critical : value >= critical) return 'critical';
  return (strict ? value > warning : value >= warning) ? 'warning' : undefined;
}

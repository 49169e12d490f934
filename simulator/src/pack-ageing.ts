// Capacity fade of a simulated pack: a cycle part that grows with amp-hour throughput, a calendar part that
// grows with the square root of time, both faster when hot (Arrhenius), and a penalty for charge put in
// below 0 °C. The truth is known exactly at every step, so tests can hold the product's estimate against it.
import { Chemistry } from '@cellwarden/shared';

/** Capacity lost so far, each part as a fraction of the new pack's capacity. */
export interface AgeingState {
  cycleFade: number;
  calendarFade: number;
  coldChargeFade: number;
}

/** The conditions of one step. */
export interface AgeingConditions {
  /** Pack current, A (positive = charging). */
  current: number;
  /** Pack temperature, °C. */
  temperature: number;
}

/** Parameters of the fade model for one chemistry. */
export interface AgeingParameters {
  /** Pre-exponential factor of cycle fade, percent per (reference-cell Ah)^exponent. */
  cycleFactor: number;
  /** Activation energy of cycle fade, J/mol. */
  cycleActivationEnergy: number;
  /** Lowering of that activation energy per C of discharge rate, J/mol per C. */
  cycleRateTerm: number;
  /** Power-law exponent of cycle fade on throughput. */
  cycleExponent: number;
  /** Calendar fade after one year at 25 °C, fraction. */
  calendarFadePerRootYear: number;
  /** Activation energy of calendar fade, J/mol. */
  calendarActivationEnergy: number;
  /** Extra fade per whole capacity's worth of charge put in at 0 °C, fraction; it grows colder. */
  coldChargeFadePerCapacity: number;
}

/** No fade yet. */
export const NEW_PACK: AgeingState = { cycleFade: 0, calendarFade: 0, coldChargeFade: 0 };

const GAS_CONSTANT = 8.314;
const KELVIN = 273.15;
const REFERENCE_K = 25 + KELVIN;
const SECONDS_PER_YEAR = 365.25 * 86_400;
// Wang et al. fitted their law to 2.2 Ah cells; throughput is scaled to that cell's size.
const REFERENCE_CELL_AH = 2.2;

/**
 * LiFePO4: cycle fade Q% = B·exp(−(Eₐ − 370.3·C)/(R·T))·Ah^0.55 with B = 31630 (the C/2 fit), Eₐ = 31700 J/mol
 * (Wang et al., "Cycle-life model for graphite-LiFePO4 cells", J. Power Sources 196 (2011) 3942–3948 —
 * from memory). Calendar fade ∝ √t with an Arrhenius factor is common in the literature; 3 % in the first
 * year at 25 °C and 50 kJ/mol are illustrative values in the published range (from memory). Charging below
 * freezing plates lithium (Waldmann et al., J. Power Sources 262 (2014) 129–135, from memory); its penalty
 * here is illustrative. Lead-acid values are illustrative only (linear in throughput, weaker heat effect).
 */
export const AGEING_PARAMETERS: Readonly<Record<Chemistry, AgeingParameters>> = {
  lifepo4: {
    cycleFactor: 31630,
    cycleActivationEnergy: 31700,
    cycleRateTerm: 370.3,
    cycleExponent: 0.55,
    calendarFadePerRootYear: 0.03,
    calendarActivationEnergy: 50_000,
    coldChargeFadePerCapacity: 0.004,
  },
  agm: leadAcid(),
  flooded: leadAcid(),
};

function leadAcid(): AgeingParameters {
  // About 20 % fade after 400 reference-cell equivalent full cycles at 25 °C (illustrative).
  return {
    cycleFactor: 20 / (400 * REFERENCE_CELL_AH * Math.exp(-25_000 / (GAS_CONSTANT * REFERENCE_K))),
    cycleActivationEnergy: 25_000,
    cycleRateTerm: 0,
    cycleExponent: 1,
    calendarFadePerRootYear: 0.03,
    calendarActivationEnergy: 40_000,
    coldChargeFadePerCapacity: 0,
  };
}

/** Fraction of the new capacity the pack still holds. */
export function remainingCapacityFraction(state: AgeingState): number {
  return Math.max(0, 1 - state.cycleFade - state.calendarFade - state.coldChargeFade);
}

/** Advances the fade by `dtSeconds` of a pack of `capacityAh` (new) under `conditions`. */
export function stepAgeing(
  state: AgeingState,
  chemistry: Chemistry,
  capacityAh: number,
  conditions: AgeingConditions,
  dtSeconds: number,
): AgeingState {
  const p = AGEING_PARAMETERS[chemistry];
  const kelvin = conditions.temperature + KELVIN;
  const hours = dtSeconds / 3600;
  const dischargeAh = Math.max(0, -conditions.current) * hours;
  const chargeAh = Math.max(0, conditions.current) * hours;
  return {
    cycleFade: cycleFadeAfter(state.cycleFade, p, kelvin, dischargeAh, capacityAh, conditions.current),
    calendarFade: calendarFadeAfter(state.calendarFade, p, kelvin, dtSeconds),
    coldChargeFade:
      state.coldChargeFade + coldChargePenalty(p, conditions.temperature, chargeAh / capacityAh),
  };
}

// Fade laws of the form Q = k(T)·x^z are stepped as "equivalent throughput/time": the x that gives the
// present fade at the present temperature, advanced by this step — so a hot spell ages faster from then on
// without rewriting the past (a common way to apply such laws under varying conditions, from memory).
function cycleFadeAfter(
  fade: number,
  p: AgeingParameters,
  kelvin: number,
  dischargeAh: number,
  capacityAh: number,
  current: number,
): number {
  if (dischargeAh <= 0) return fade;
  const cRate = Math.abs(current) / capacityAh;
  const k =
    (p.cycleFactor / 100) *
    Math.exp(-(p.cycleActivationEnergy - p.cycleRateTerm * cRate) / (GAS_CONSTANT * kelvin));
  const equivalentAh = Math.pow(fade / k, 1 / p.cycleExponent);
  const referenceAh = (dischargeAh * REFERENCE_CELL_AH) / capacityAh;
  return k * Math.pow(equivalentAh + referenceAh, p.cycleExponent);
}

function calendarFadeAfter(fade: number, p: AgeingParameters, kelvin: number, dtSeconds: number): number {
  const arrhenius = Math.exp((-p.calendarActivationEnergy / GAS_CONSTANT) * (1 / kelvin - 1 / REFERENCE_K));
  const k = p.calendarFadePerRootYear * arrhenius;
  const equivalentYears = (fade / k) ** 2;
  return k * Math.sqrt(equivalentYears + dtSeconds / SECONDS_PER_YEAR);
}

function coldChargePenalty(p: AgeingParameters, temperature: number, chargeCapacities: number): number {
  if (temperature >= 0 || chargeCapacities <= 0) return 0;
  // Plating worsens as it gets colder: twice the penalty at −5 °C, three times at −10 °C (illustrative).
  return p.coldChargeFadePerCapacity * chargeCapacities * (1 - temperature / 5);
}

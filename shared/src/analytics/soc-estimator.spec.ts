import fc from 'fast-check';
import { Chemistry } from '../battery/chemistry-profile';
import { openCircuitVoltage } from '../battery/battery-math';
import { BatteryReading } from '../telemetry/reading';
import { BatterySetup, resolveBatterySetup } from './battery-setup';
import { SocEstimate, stepSocEstimate } from './soc-estimator';

const start = Date.UTC(2026, 11, 2, 18, 0, 0);
const MINUTE = 60_000;

function bank(chemistry: Chemistry, extra: Partial<BatterySetup> = {}) {
  return resolveBatterySetup({
    chemistry,
    nominalVoltage: 12,
    ratedCapacityAh: 100,
    usableCapacityAh: 100,
    ...extra,
  });
}

function reading(minutes: number, values: Partial<BatteryReading> = {}): BatteryReading {
  return { measuredAt: start + minutes * MINUTE, voltage: 13.2, current: 0, temperature: 25, ...values };
}

/** Feeds one reading every `stepSeconds` for `minutes`, all with the same values. */
function hold(
  state: SocEstimate,
  battery: ReturnType<typeof bank>,
  fromMinute: number,
  minutes: number,
  values: Partial<BatteryReading>,
  stepSeconds = 10,
): SocEstimate {
  let next = state;
  for (let s = stepSeconds; s <= minutes * 60; s += stepSeconds) {
    next = stepSocEstimate(next, reading(fromMinute + s / 60, values), battery);
  }
  return next;
}

describe('stepSocEstimate', () => {
  it('starts from the reported state of charge when the device sends one', () => {
    const estimate = stepSocEstimate(undefined, reading(0, { stateOfCharge: 64 }), bank('lifepo4'));
    expect(estimate.stateOfCharge).toBe(64);
    expect(estimate.disagreement).toBe(0);
  });

  it('starts from the open-circuit voltage when the device reports no state of charge', () => {
    // Lead-acid OCV tables, general reference (from memory): a rested flooded 12 V battery at 12.1 V is ≈ 50 %
    const estimate = stepSocEstimate(undefined, reading(0, { voltage: 12.1 }), bank('flooded'));
    expect(estimate.stateOfCharge).toBeCloseTo(50, 0);
  });

  it('counts charge in ampere-hours, less the charge efficiency', () => {
    const battery = bank('lifepo4');
    const first = stepSocEstimate(undefined, reading(0, { stateOfCharge: 40 }), battery);
    const after = hold(first, battery, 0, 60, { current: 10 });
    // Coulomb counting, ΔAh = ∫ I dt (general reference): 10 A × 1 h = 10 Ah; × 0.99 efficiency = 9.9 Ah of 100 Ah
    expect(after.stateOfCharge).toBeCloseTo(49.9, 6);
  });

  it('counts a LiFePO4 discharge at face value', () => {
    const battery = bank('lifepo4');
    const first = stepSocEstimate(undefined, reading(0, { stateOfCharge: 80 }), battery);
    const after = hold(first, battery, 0, 60, { current: -10 });
    // ΔAh = ∫ I dt: 10 A for 1 h is 10 Ah, 10 % of 100 Ah (arithmetic)
    expect(after.stateOfCharge).toBeCloseTo(70, 6);
  });

  it('drains a lead-acid bank faster at high current, by Peukert’s law', () => {
    const battery = bank('flooded');
    const first = stepSocEstimate(undefined, reading(0, { stateOfCharge: 100 }), battery);
    const after = hold(first, battery, 0, 60, { current: -10, voltage: 12.2 });
    // Peukert's law (Peukert 1897; Wikipedia "Peukert's law"): t = H·(C/(I·H))^k, here H = 20 h, C = 100 Ah,
    // I = 10 A, k = 1.25 → t ≈ 8.41 h to empty, so one hour uses 1/t of the capacity
    const hoursToEmpty = 20 * Math.pow(100 / (10 * 20), 1.25);
    expect(after.stateOfCharge).toBeCloseTo(100 - 100 / hoursToEmpty, 4);
  });

  it('takes a larger share of a colder, smaller usable capacity for the same ampere-hours', () => {
    const battery = bank('lifepo4');
    const first = stepSocEstimate(undefined, reading(0, { stateOfCharge: 80, temperature: 0 }), battery);
    const after = hold(first, battery, 0, 60, { current: -10, temperature: 0 });
    // Arithmetic on the profile's capacity table: 10 Ah of 0.88 × 100 Ah usable at 0 °C = 11.36 %
    expect(after.stateOfCharge).toBeCloseTo(80 - 1000 / 88, 4);
  });

  it('does not integrate across a long silence or backwards in time', () => {
    const battery = bank('lifepo4');
    const first = stepSocEstimate(undefined, reading(0, { stateOfCharge: 50, current: -50 }), battery);
    // 6 h offline: the gap exceeds MAX_INTEGRATION_GAP_MS, so no guess is made about what flowed meanwhile
    const late = stepSocEstimate(first, reading(360, { current: -50 }), battery);
    expect(late.stateOfCharge).toBe(50);
    const replayed = stepSocEstimate(late, reading(100, { current: -50 }), battery);
    expect(replayed).toBe(late);
  });

  it('re-syncs to 100 % once the charged voltage and tail current hold long enough', () => {
    // A bank whose owner entered too large a capacity, so counting alone under-reads the charge.
    const battery = bank('lifepo4', { usableCapacityAh: 200 });
    let estimate = stepSocEstimate(undefined, reading(0, { stateOfCharge: 50 }), battery);
    estimate = hold(estimate, battery, 0, 60, { current: -20, voltage: 13.1 });
    estimate = hold(estimate, battery, 60, 120, { current: 30, voltage: 13.6 });
    expect(estimate.stateOfCharge).toBeLessThan(70);
    // Absorption: 14.1 V (≥ 14.0 V charged level), 2 A (≤ 4 A tail). Not yet full after 2 min of the 3 min hold.
    estimate = hold(estimate, battery, 180, 2, { current: 2, voltage: 14.1 });
    expect(estimate.stateOfCharge).toBeLessThan(75);
    estimate = hold(estimate, battery, 182, 2, { current: 2, voltage: 14.1 });
    expect(estimate.stateOfCharge).toBe(100);
    expect(estimate.lastFullAt).toBe(start + 184 * MINUTE);
  });

  it('recognises a hot AGM bank on a compensating charger as full', () => {
    const battery = bank('agm');
    // AGM datasheets (from memory): absorption 14.4 V at 25 °C, −4 mV/°C per cell; at 40 °C a compensating
    // charger absorbs at 14.4 − 0.004 × 6 × 15 = 14.04 V, below the 25 °C charged level of 14.2 V
    let estimate = stepSocEstimate(undefined, reading(0, { stateOfCharge: 80, temperature: 40 }), battery);
    estimate = hold(estimate, battery, 0, 5, { current: 2, voltage: 14.04, temperature: 40 });
    expect(estimate.stateOfCharge).toBe(100);
    // The same voltage at 25 °C is still short of the end of absorption
    let cool = stepSocEstimate(undefined, reading(0, { stateOfCharge: 80 }), battery);
    cool = hold(cool, battery, 0, 5, { current: 2, voltage: 14.04 });
    expect(cool.stateOfCharge).toBeLessThan(100);
  });

  it('does not call a bank full while the charge current is still above the tail current', () => {
    const battery = bank('lifepo4');
    let estimate = stepSocEstimate(undefined, reading(0, { stateOfCharge: 70 }), battery);
    estimate = hold(estimate, battery, 0, 10, { current: 40, voltage: 14.1 });
    expect(estimate.stateOfCharge).toBeLessThan(80);
  });

  it('corrects from the resting voltage only after the configured rest', () => {
    const battery = bank('agm', { restMinutes: 30 });
    const rested = openCircuitVoltage('agm', 12, 50);
    let estimate = stepSocEstimate(undefined, reading(0, { stateOfCharge: 80, voltage: rested }), battery);
    estimate = hold(estimate, battery, 0, 29, { voltage: rested });
    expect(estimate.stateOfCharge).toBe(80);
    estimate = hold(estimate, battery, 29, 1, { voltage: rested });
    // AGM OCV ≈ 12.24 V at 50 % (general reference tables, from memory); its steep curve earns a near-full weight
    expect(estimate.stateOfCharge).toBeGreaterThan(50);
    expect(estimate.stateOfCharge).toBeLessThan(55);
    const corrected = estimate.stateOfCharge;
    estimate = hold(estimate, battery, 30, 60, { voltage: rested });
    // One correction per rest: repeating it would undo the weighting.
    expect(estimate.stateOfCharge).toBe(corrected);
  });

  it('restarts the rest clock whenever current flows', () => {
    const battery = bank('agm', { restMinutes: 30 });
    const rested = openCircuitVoltage('agm', 12, 50);
    let estimate = stepSocEstimate(undefined, reading(0, { stateOfCharge: 80, voltage: rested }), battery);
    estimate = hold(estimate, battery, 0, 20, { voltage: rested });
    estimate = stepSocEstimate(estimate, reading(20.1, { current: -5, voltage: rested }), battery);
    estimate = hold(estimate, battery, 20.1, 20, { voltage: rested });
    expect(estimate.stateOfCharge).toBeGreaterThan(79);
  });

  it('gives a LiFePO4 resting voltage in the flat middle of its curve only a small weight', () => {
    const battery = bank('lifepo4', { restMinutes: 30 });
    const rested = openCircuitVoltage('lifepo4', 12, 50);
    let estimate = stepSocEstimate(undefined, reading(0, { stateOfCharge: 80, voltage: rested }), battery);
    estimate = hold(estimate, battery, 0, 31, { voltage: rested });
    // LiFePO4 OCV is nearly flat from ≈20 % to ≈90 % (cell datasheets, from memory): ~5 mV per % per 12 V
    expect(estimate.stateOfCharge).toBeLessThan(80);
    expect(estimate.stateOfCharge).toBeGreaterThan(65);
  });

  it('exposes the gap between the reported and the estimated state of charge', () => {
    const battery = bank('lifepo4');
    let estimate = stepSocEstimate(undefined, reading(0, { stateOfCharge: 60 }), battery);
    estimate = hold(estimate, battery, 0, 60, { current: -10, stateOfCharge: 60 });
    // ΔAh = ∫ I dt: 10 Ah of 100 Ah, so 50 % estimated against 60 % reported
    expect(estimate.disagreement).toBeCloseTo(10, 6);
    estimate = stepSocEstimate(estimate, reading(61, { current: -10 }), battery);
    expect(estimate.disagreement).toBeUndefined();
  });

  it('keeps the estimate within 0–100 % for any sequence of finite readings', () => {
    const readingArb = fc.record({
      gapMs: fc.integer({ min: -60_000, max: 20 * MINUTE }),
      voltage: fc.double({ min: 0, max: 70, noNaN: true }),
      current: fc.double({ min: -2000, max: 2000, noNaN: true }),
      temperature: fc.double({ min: -60, max: 100, noNaN: true }),
      stateOfCharge: fc.option(fc.double({ min: 0, max: 100, noNaN: true }), { nil: undefined }),
    });
    const setupArb = fc.record({
      chemistry: fc.constantFrom<Chemistry>('lifepo4', 'agm', 'flooded'),
      nominalVoltage: fc.constantFrom<12 | 24 | 48>(12, 24, 48),
      ratedCapacityAh: fc.double({ min: 1, max: 2000, noNaN: true }),
      usableCapacityAh: fc.double({ min: 0.5, max: 2000, noNaN: true }),
      restMinutes: fc.integer({ min: 0, max: 60 }),
    });
    fc.assert(
      fc.property(setupArb, fc.array(readingArb, { minLength: 1, maxLength: 60 }), (setup, steps) => {
        const battery = resolveBatterySetup(setup);
        let at = start;
        let estimate: SocEstimate | undefined;
        for (const { gapMs, stateOfCharge, ...values } of steps) {
          at += gapMs;
          const next: BatteryReading = { measuredAt: at, ...values };
          if (stateOfCharge !== undefined) next.stateOfCharge = stateOfCharge;
          estimate = stepSocEstimate(estimate, next, battery);
          expect(estimate.stateOfCharge).toBeGreaterThanOrEqual(0);
          expect(estimate.stateOfCharge).toBeLessThanOrEqual(100);
        }
      }),
    );
  });
});

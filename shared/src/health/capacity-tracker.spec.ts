import { BatterySetup } from '../analytics/battery-setup';
import { AnalyticsSettingError } from '../analytics/analytics-error';
import { CURRENT_OFFSET_SIGMA_A, REST_VOLTAGE_SIGMA_PER_BLOCK_V } from './capacity-measurement';
import { createCapacityTracker } from './capacity-tracker';
import { CapacitySample, MinuteSummary } from './health-types';

const MINUTE = 60_000;
const T0 = Date.UTC(2026, 0, 5, 8, 0);
const LIFEPO4: BatterySetup = {
  chemistry: 'lifepo4',
  nominalVoltage: 12,
  ratedCapacityAh: 100,
  usableCapacityAh: 100,
};

/** A run of identical minutes: `current` A at `voltage` V and 25 °C. */
function minutes(
  from: number,
  count: number,
  voltage: number,
  current: number,
  temperature = 25,
): MinuteSummary[] {
  return Array.from({ length: count }, (_, i) => ({
    start: from + i * MINUTE,
    voltageMin: voltage,
    voltageMax: voltage,
    voltageLast: voltage,
    currentMin: current,
    currentMax: current,
    currentMean: current,
    temperatureMean: temperature,
    ahIn: Math.max(0, current) / 60,
    ahOut: Math.max(0, -current) / 60,
  }));
}

/** End of absorption (5 min at 14.2 V, 2 A), `hours` at 10 A of discharge, then two hours resting at `restVoltage`. */
function fullThenDischargeThenRest(hours: number, restVoltage: number): MinuteSummary[] {
  const full = minutes(T0, 5, 14.2, 2);
  const discharge = minutes(T0 + 5 * MINUTE, hours * 60, 13.0, -10);
  const rest = minutes(T0 + (5 + hours * 60) * MINUTE, 121, restVoltage, 0);
  return [...full, ...discharge, ...rest];
}

function samplesOf(setup: BatterySetup, stream: readonly MinuteSummary[]): CapacitySample[] {
  const tracker = createCapacityTracker(setup);
  return stream.flatMap((m) => tracker.push(m) ?? []);
}

// Peukert's law normalises a 10 A draw of a 100 Ah, 20 h battery to the rated 5 A: 5·(10/5)^1.03 A.
const PEUKERT_10A = (5 * Math.pow(2, 1.03)) / 10;

describe('capacity tracker', () => {
  it('measures capacity from a full charge, a known draw and a rest low on the curve, as worked by hand', () => {
    // 8 h at 10 A (80 Ah, 81.7 Ah at the rated rate), then rested at 12.9 V: 15 % ± 1 % on the LiFePO4 curve.
    const [sample] = samplesOf(LIFEPO4, fullThenDischargeThenRest(8, 12.9));
    const counted = 80 * PEUKERT_10A;
    expect(sample.method).toBe('rested-ocv');
    expect(sample.fullAt).toBe(T0 + 5 * MINUTE);
    expect(sample.at).toBe(T0 + (5 + 480 + 120) * MINUTE);
    expect(sample.countedAh).toBeCloseTo(counted, 6);
    expect(sample.socAtEnd).toBeCloseTo(0.15, 6);
    expect(sample.usableAh).toBeCloseTo(counted / 0.85, 6);
    // Coulomb counting between full and a rested OCV (Plett, BMS Vol. I, 2015; Ng et al., Appl. Energy 86 (2009)
    // 1506–1511 — from memory); errors in quadrature: offset × 10 h, and the end SoC's ± 1 % through C/(1 − s).
    const offset = (CURRENT_OFFSET_SIGMA_A * 10) / 0.85;
    const endSoc = ((counted / 0.85) * (REST_VOLTAGE_SIGMA_PER_BLOCK_V / 0.02 / 100)) / 0.85;
    expect(sample.sigmaAh).toBeCloseTo(Math.hypot(offset, endSoc), 6);
  });

  it('waits two hours of rest on LiFePO4 before trusting the voltage', () => {
    const stream = fullThenDischargeThenRest(8, 12.9);
    const tracker = createCapacityTracker(LIFEPO4);
    const found = stream.map((m) => tracker.push(m));
    expect(found.findIndex((s) => s !== undefined)).toBe(5 + 480 + 119);
  });

  it('refuses a rest on the flat LiFePO4 plateau, where the voltage barely tells the charge', () => {
    // 13.15 V is 50 % ± 4 %: the capacity would be known to ± 8 % at best.
    expect(samplesOf(LIFEPO4, fullThenDischargeThenRest(5, 13.15))).toEqual([]);
  });

  it('refuses a discharge too shallow to say anything', () => {
    const agm: BatterySetup = {
      chemistry: 'agm',
      nominalVoltage: 12,
      ratedCapacityAh: 100,
      usableCapacityAh: 50,
    };
    // AGM at 12.62 V rests at 80 %: a 20 % draw is below the 30 % minimum.
    const stream = [...minutes(T0, 5, 14.4, 2), ...minutes(T0 + 5 * MINUTE, 120, 12.4, -10)];
    stream.push(...minutes(T0 + 125 * MINUTE, 241, 12.62, 0));
    expect(samplesOf(agm, stream)).toEqual([]);
  });

  it("reports a lead-acid bank on the owner's usable scale: half the label when half is usable", () => {
    const agm: BatterySetup = {
      chemistry: 'agm',
      nominalVoltage: 12,
      ratedCapacityAh: 100,
      usableCapacityAh: 50,
    };
    // 6 h at 10 A, then four hours' rest at 12.24 V: 50 % on the AGM curve.
    const stream = [...minutes(T0, 5, 14.4, 2), ...minutes(T0 + 5 * MINUTE, 360, 12.2, -10)];
    stream.push(...minutes(T0 + 365 * MINUTE, 241, 12.24, 0));
    const [sample] = samplesOf(agm, stream);
    // AGM's Peukert exponent is 1.15: 60 Ah at 10 A is 60·2^0.15 Ah at the rated 5 A.
    const whole = (60 * Math.pow(2, 0.15)) / 0.5;
    expect(sample.usableAh).toBeCloseTo(whole / 2, 6);
    expect(sample.at - sample.fullAt).toBe((360 + 240) * MINUTE);
  });

  it('takes a BMS low-voltage cut-off as the bottom of the scale', () => {
    const stream = [...minutes(T0, 5, 14.2, 2), ...minutes(T0 + 5 * MINUTE, 500, 12.5, -10)];
    const cut = minutes(T0 + 505 * MINUTE, 1, 10.3, -10)[0];
    stream.push({ ...cut, voltageMin: 9.9, currentMax: 0, currentMean: -5, ahOut: 5 / 60 });
    stream.push(...minutes(T0 + 506 * MINUTE, 10, 11.9, 0));
    const [sample] = samplesOf(LIFEPO4, stream);
    expect(sample.method).toBe('low-voltage-cutoff');
    expect(sample.socAtEnd).toBe(0);
    expect(sample.at).toBe(T0 + 507 * MINUTE);
    // The cut minute drew 5 A, the rated current itself: no Peukert correction.
    const counted = (500 / 60) * 10 * PEUKERT_10A + 5 / 60;
    expect(sample.usableAh).toBeCloseTo(counted, 6);
  });

  it('does not count charge into an already full battery as stored', () => {
    // Five hours of 2 A float after the sync (below the charged voltage, so no re-sync) go to heat, not charge.
    const floatThenUse = [
      ...minutes(T0, 5, 14.2, 2),
      ...minutes(T0 + 5 * MINUTE, 300, 13.5, 2),
      ...minutes(T0 + 305 * MINUTE, 480, 13.0, -10),
      ...minutes(T0 + 785 * MINUTE, 121, 12.9, 0),
    ];
    const [sample] = samplesOf(LIFEPO4, floatThenUse);
    expect(sample.countedAh).toBeCloseTo(80 * PEUKERT_10A, 6);
  });

  it('counts nothing across a gap in the data, since what flowed then is unknown', () => {
    const stream = fullThenDischargeThenRest(8, 12.9).filter(
      (m) => m.start < T0 + 100 * MINUTE || m.start >= T0 + 110 * MINUTE,
    );
    expect(samplesOf(LIFEPO4, stream)).toEqual([]);
  });

  it('gives nothing without a full charge to start from', () => {
    expect(samplesOf(LIFEPO4, fullThenDischargeThenRest(8, 12.9).slice(5))).toEqual([]);
  });

  it('ignores replayed and malformed minutes', () => {
    const stream = fullThenDischargeThenRest(8, 12.9);
    const noisy = stream.flatMap((m, i) =>
      i % 50 === 7 ? [m, { ...m }, { ...m, start: m.start + 1, currentMean: Number.NaN }] : [m],
    );
    expect(samplesOf(LIFEPO4, noisy)).toEqual(samplesOf(LIFEPO4, stream));
  });

  it('resumes from its JSON state exactly where it stopped', () => {
    const stream = [...fullThenDischargeThenRest(8, 12.9), ...fullThenDischargeThenRest(9, 12.85).map(shift)];
    const whole = samplesOf(LIFEPO4, stream);
    for (const cut of [3, 200, 600, 700]) {
      const first = createCapacityTracker(LIFEPO4);
      const before = stream.slice(0, cut).flatMap((m) => first.push(m) ?? []);
      const saved = JSON.parse(JSON.stringify(first.state()));
      const second = createCapacityTracker(LIFEPO4, saved);
      const after = stream.slice(cut).flatMap((m) => second.push(m) ?? []);
      expect([...before, ...after]).toEqual(whole);
    }
    expect(whole).toHaveLength(2);
  });

  it('keeps only a better sample after one already taken since the same full charge', () => {
    // Rest at 12.9 V (15 %), then more draw and a second rest at 12.65 V (7.5 %): deeper, so more certain.
    const first = fullThenDischargeThenRest(8, 12.9);
    const more = minutes(T0 + 606 * MINUTE, 30, 12.8, -10);
    const deeper = minutes(T0 + 636 * MINUTE, 121, 12.65, 0);
    const worse = [...minutes(T0 + 757 * MINUTE, 1, 12.8, 5), ...minutes(T0 + 758 * MINUTE, 121, 12.66, 0)];
    const samples = samplesOf(LIFEPO4, [...first, ...more, ...deeper, ...worse]);
    expect(samples.map((s) => s.socAtEnd.toFixed(3))).toEqual(['0.150', '0.075']);
    expect(new Set(samples.map((s) => s.fullAt)).size).toBe(1);
  });

  it('refuses a setup no real battery has, naming the field', () => {
    expect(() => createCapacityTracker({ ...LIFEPO4, ratedCapacityAh: -5 })).toThrow(AnalyticsSettingError);
    expect(() => createCapacityTracker({ ...LIFEPO4, ratedCapacityAh: -5 })).toThrow(/ratedCapacityAh/);
  });
});

function shift(m: MinuteSummary): MinuteSummary {
  return { ...m, start: m.start + 2 * 86_400_000 };
}

import { inverterDcCurrent } from './energy-budget';
import { InstallerInputError } from './installer-input-error';
import { checkWireAndFuse, WIRE_AND_FUSE_CAUTIONS, WireFuseCheckInput } from './wire-fuse-check';

// Conventions: the exact run length (no rounding up to a table's next column); stranded conductors unless a
// test says otherwise; a 20 °C conductor for the drop; marine rules unless a test says otherwise.
const charger: WireFuseCheckInput = {
  currentA: 60,
  oneWayLengthM: 2,
  systemVoltage: 12,
  allowedDropPercent: 3,
  insulationRatingC: 105,
};

const codes = (input: WireFuseCheckInput) => checkWireAndFuse(input).verdict.findings.map((f) => f.code);
const errors = (input: WireFuseCheckInput) =>
  checkWireAndFuse(input)
    .verdict.findings.filter((f) => f.severity === 'error')
    .map((f) => f.code);

describe('wire and fuse check', () => {
  it('sizes a 60 A charger 2 m from the battery at 12 V and names its fuse range', () => {
    const result = checkWireAndFuse(charger);
    // NEC Chapter 9 Table 8 stranded, corrected by its note 2 (α = 0.00323) to 20 °C: 8 AWG 0.778 Ω/kft ×
    // 0.8224 = 2.099 mΩ/m → 60 A × 4 m = 0.504 V = 4.2 % > 3 %; 6 AWG 0.491 × 0.8224 = 1.325 mΩ/m → 2.65 %
    expect(result.minimumGaugeByDrop).toBe('6');
    expect(result.drop?.percent).toBeCloseTo(2.65, 2);
    // NEC 210.19(A)(1) 125 % → 75 A; 33 CFR 183.425 Table 5, 105 °C: 8 AWG 80 A
    expect(result.minimumGaugeByAmpacity).toBe('8');
    expect(result).toMatchObject({ governingGauge: '6', governedBy: 'voltage-drop', checkedGauge: '6' });
    // 33 CFR 183.455(c)(1): under 50 V a fuse may reach 150 % of Table 5's 120 A for 6 AWG = 180 A
    expect(result.fuse).toMatchObject({
      minimumA: 75,
      maximumA: 180,
      standardRatingsA: [80, 90, 100, 125, 150, 175],
      recommendedA: 80,
    });
    expect(result.recommendation?.fuse.recommendedRule).toMatch(/ampacity/);
    // 33 CFR 183.455(b): no distance given is a warning asking for it, not a pass on placement
    expect(result.verdict.ok).toBe(true);
    expect(codes(charger)).toEqual(['fuse-distance-not-given']);
  });

  it('accepts the 60 A DC-DC charger on 4 AWG with a 100 A class T fuse 150 mm from a 200 Ah LiFePO4 bank', () => {
    const result = checkWireAndFuse({
      ...charger,
      proposedGauge: '4',
      proposedFuseA: 100,
      fuseDistanceM: 0.15,
      bank: { chemistry: 'lifepo4', capacityAh: 200 },
      fuseInterruptingRatingA: 20000,
    });
    // NEC Chapter 9 Table 8 stranded 4 AWG 0.308 Ω/kft at 75 °C; × 0.8224 (note 2, 20 °C) = 0.831 mΩ/m;
    // 60 A × 4 m × 0.831 mΩ/m = 0.199 V = 1.66 % of 12 V
    expect(result.drop?.percent).toBeCloseTo(1.66, 2);
    // 33 CFR 183.425 Table 5, 105 °C: 4 AWG 160 A ≥ 100 A ≥ 75 A (125 % of 60 A)
    expect(result.ampacityA).toBe(160);
    // 33 CFR 183.455(b)(1): 150 mm is within 7 in (178 mm)
    expect(result.verdict).toEqual({
      ok: true,
      findings: [expect.objectContaining({ code: 'fuse-placement-ok', severity: 'info' })],
    });
  });

  it('finds a fuse for the 2,000 W inverter feeder on 12 V that the old 100 % cap could not', () => {
    // By hand: I = P / (V × η) = 2,000 / (12 × 0.9) = 185.2 A; 125 % = 231.5 A (NEC 210.19(A)(1))
    const currentA = inverterDcCurrent(2000, 12, 0.9);
    const nec = checkWireAndFuse({ ...charger, currentA, oneWayLengthM: 1.5, rules: 'nec' });
    // 33 CFR 183.425 Table 5, 105 °C: 1 AWG 245 A ≥ 231.5 A; no common rating lies in 231.5–245 A, but
    // NEC 240.4(B) allows the next standard rating (NEC 240.6(A)) above 245 A: 250 A
    expect(nec.governingGauge).toBe('1');
    expect(nec.recommendation?.fuse).toMatchObject({
      maximumA: 250,
      standardRatingsA: [250],
      recommendedA: 250,
    });
    expect(nec.recommendation?.fuse.recommendedRule).toMatch(/NEC 240\.4\(B\)/);
    // 33 CFR 183.455(c)(1): up to 150 % × 245 A = 367.5 A under 50 V
    const marine = checkWireAndFuse({ ...charger, currentA, oneWayLengthM: 1.5 });
    expect(marine.recommendation?.fuse).toMatchObject({ maximumA: 367.5, standardRatingsA: [250, 300, 350] });
    expect(marine.recommendation?.fuse.recommendedRule).toMatch(/183\.455\(c\)\(1\)/);
    for (const result of [nec, marine]) {
      expect(result.verdict.findings.filter((f) => f.severity === 'error')).toEqual([]);
    }
  });

  it('allows a fuse above the ampacity only as far as the rule goes', () => {
    // 33 CFR 183.425 Table 5, 105 °C: 4 AWG 160 A; 33 CFR 183.455(c)(1): at most 240 A under 50 V
    expect(codes({ ...charger, proposedGauge: '4', proposedFuseA: 200, fuseDistanceM: 0 })).toEqual([
      'fuse-above-ampacity-allowed',
      'fuse-placement-ok',
    ]);
    expect(errors({ ...charger, proposedGauge: '4', proposedFuseA: 250, fuseDistanceM: 0 })).toEqual([
      'fuse-above-ampacity',
    ]);
    // NEC 240.4: 160 A is a standard rating (NEC 240.6(A)), so no allowance: 200 A is too large
    expect(errors({ ...charger, rules: 'nec', proposedGauge: '4', proposedFuseA: 200 })).toEqual([
      'fuse-above-ampacity',
    ]);
    // 33 CFR 183.455(c)(2) for a 48 V bank (it charges above 50 V): 6 AWG 120 A → next common rating 125 A
    const at48 = checkWireAndFuse({ ...charger, systemVoltage: 48, proposedGauge: '6' });
    expect(at48.fuse?.maximumA).toBe(125);
  });

  it('refuses a fuse larger than the wire may have and a drop above the allowance', () => {
    const result = checkWireAndFuse({ ...charger, proposedGauge: '8', proposedFuseA: 125, fuseDistanceM: 0 });
    // 33 CFR 183.425 Table 5, 105 °C: 8 AWG 80 A; 150 % = 120 A < 125 A; drop 4.2 % > 3 % (first test)
    expect(result.verdict.ok).toBe(false);
    expect(errors({ ...charger, proposedGauge: '8', proposedFuseA: 125 })).toEqual([
      'drop-above-allowed',
      'fuse-above-ampacity',
    ]);
    expect(result.verdict.findings[1].message).toMatch(
      /exceeds the 120 A allowed on 8 AWG \(ampacity 80 A; 33 CFR/,
    );
  });

  it('refuses a fuse that leaves no margin over the continuous current', () => {
    // NEC 210.20(A) continuous-load rule: a fuse ≥ 125 % × 60 A = 75 A; 70 A is below
    expect(errors({ ...charger, proposedGauge: '4', proposedFuseA: 70 })).toEqual([
      'fuse-below-continuous-margin',
    ]);
  });

  it('flags a wire too thin for the current and notes an uncommon fuse rating', () => {
    // 33 CFR 183.425 Table 5, 105 °C: 10 AWG 60 A < 75 A needed; 85 A is absent from the common DC ratings
    // (common practice); no allowance protects a conductor already too thin for the load, so 85 A > 60 A fails
    expect(codes({ ...charger, oneWayLengthM: 0.3, proposedGauge: '10', proposedFuseA: 85 })).toEqual([
      'gauge-below-current',
      'fuse-above-ampacity',
      'fuse-distance-not-given',
      'fuse-rating-uncommon',
    ]);
  });

  it('reports when no common fuse fits a proposed conductor and no gauge can be recommended', () => {
    // NEC 210.20(A): 125 % × 350 A = 437.5 A; Table 5 105 °C 4/0 445 A → NEC 240.4(B) next standard 450 A;
    // the common DC ratings (common practice) jump from 400 A to 500 A
    const input: WireFuseCheckInput = { ...charger, currentA: 350, oneWayLengthM: 0.2, rules: 'nec' };
    expect(errors({ ...input, proposedGauge: '4/0' })).toEqual(['no-gauge-with-fuse', 'no-fuse-fits']);
    expect(checkWireAndFuse(input).governingGauge).toBeUndefined();
    // 33 CFR 183.455(c)(1) allows 150 % × 445 A = 667.5 A: 500 A fits
    expect(checkWireAndFuse({ ...input, rules: 'marine' }).recommendation?.fuse.recommendedA).toBe(500);
  });

  it('derates for an engine space, a bundle and a hot ambient', () => {
    const load: WireFuseCheckInput = {
      ...charger,
      currentA: 100,
      oneWayLengthM: 0.5,
      allowedDropPercent: 10,
    };
    // 33 CFR 183.425 Table 5, 105 °C: 6 AWG 120 A < 125 A, 4 AWG 160 A
    expect(checkWireAndFuse(load).minimumGaugeByAmpacity).toBe('4');
    // 33 CFR 183.425(c), Table 5 note 1 (50 °C; NEC equation √((105 − 50)/(105 − 30)) = 0.86): 160 × 0.86 = 137.6 A
    const engine = checkWireAndFuse({ ...load, engineSpace: true, proposedGauge: '4' });
    expect(engine.ampacityA).toBeCloseTo(137.6, 6);
    expect(engine.deratings).toEqual([expect.objectContaining({ code: 'engine-space', factor: 0.86 })]);
    // 33 CFR 183.425 Table 5 note 2 (secondary: USCG guideline reprinted in a marine catalogue), 4–6 bundled:
    // × 0.60; 4 AWG 96 A, 3 AWG 108 A, 2 AWG 126 A ≥ 125 A
    expect(checkWireAndFuse({ ...load, bundledConductors: 5 }).minimumGaugeByAmpacity).toBe('2');
    // NEC Table 310.15(B)(1), 41–45 °C row, 90 °C column (secondary: published reprint): 0.87
    const hot = checkWireAndFuse({ ...load, insulationRatingC: 90, ambientC: 45, proposedGauge: '4' });
    expect(hot.deratings).toEqual([expect.objectContaining({ code: 'ambient', factor: 0.87 })]);
    // 33 CFR 183.425 Table 5, 90 °C: 4 AWG 135 A × 0.87 = 117.5 A < 125 A
    expect(hot.verdict.findings.map((f) => f.code)).toContain('gauge-below-current');
  });

  it('never recommends a conductor below the smallest the marine rules allow', () => {
    const lamp: WireFuseCheckInput = { ...charger, currentA: 1, oneWayLengthM: 1, allowedDropPercent: 10 };
    // 33 CFR 183.425(e): each conductor installed separately at least 16 AWG
    expect(checkWireAndFuse(lamp)).toMatchObject({ governingGauge: '16', governedBy: 'minimum-size' });
    // 33 CFR 183.425(d): 18 AWG within a multiconductor sheath
    expect(checkWireAndFuse({ ...lamp, sheathed: true }).governingGauge).toBe('18');
    expect(checkWireAndFuse({ ...lamp, rules: 'nec' }).governingGauge).toBe('18');
    expect(errors({ ...lamp, proposedGauge: '18' })).toEqual(['below-minimum-size']);
  });

  it('judges the fuse distance from the battery', () => {
    const at = (fuseDistanceM: number, sheathed = false) =>
      errors({ ...charger, proposedGauge: '4', proposedFuseA: 100, fuseDistanceM, sheathed });
    // 33 CFR 183.455(b): at the source; (b)(1) within 7 in = 178 mm; (b)(2) within 40 in = 1.016 m if sheathed
    expect(at(0)).toEqual([]);
    expect(at(0.17)).toEqual([]);
    expect(at(0.5)).toEqual(['fuse-too-far']);
    expect(at(0.5, true)).toEqual([]);
    expect(at(1.2, true)).toEqual(['fuse-too-far']);
  });

  it("compares the fuse's interrupting rating with the bank's short-circuit current", () => {
    const input: WireFuseCheckInput = {
      ...charger,
      proposedGauge: '4',
      proposedFuseA: 100,
      fuseDistanceM: 0,
      bank: { chemistry: 'lifepo4', capacityAh: 200 },
    };
    // From memory (cell datasheets), common practice: 1.5 mΩ per 100 Ah LiFePO4 block → 200 Ah 0.75 mΩ;
    // 13.6 V / 0.75 mΩ = 18,133 A
    expect(checkWireAndFuse(input).faultCurrentA).toBeCloseTo(18133, 0);
    expect(codes(input)).toEqual(['interrupting-rating-not-given', 'fuse-placement-ok']);
    expect(errors({ ...input, fuseInterruptingRatingA: 2000 })).toEqual(['interrupting-rating-below-fault']);
  });

  it('reports when no offered gauge is enough', () => {
    // 33 CFR 183.425 Table 5, 60 °C: 4/0 carries 300 A < 125 % × 300 A = 375 A; NEC Table 8 stranded 4/0
    // 0.0608 Ω/kft × 0.8224 = 0.164 mΩ/m; 300 A × 40 m = 1.97 V = 16 % of 12 V
    const result = checkWireAndFuse({ ...charger, currentA: 300, oneWayLengthM: 20, insulationRatingC: 60 });
    expect(result.governingGauge).toBeUndefined();
    expect(errors({ ...charger, currentA: 300, oneWayLengthM: 20, insulationRatingC: 60 })).toEqual([
      'no-gauge-meets-drop',
      'no-gauge-carries-current',
    ]);
  });

  it('names the field of each bad input', () => {
    const bad: [Partial<WireFuseCheckInput> & Record<string, unknown>, string][] = [
      [{ currentA: Number.NaN }, 'currentA'],
      [{ currentA: 0 }, 'currentA'],
      [{ oneWayLengthM: -1 }, 'oneWayLengthM'],
      [{ systemVoltage: 36 as 12 }, 'systemVoltage'],
      [{ allowedDropPercent: 50 }, 'allowedDropPercent'],
      [{ insulationRatingC: 80 as 60 }, 'insulationRatingC'],
      [{ proposedGauge: '5' as '4' }, 'proposedGauge'],
      [{ proposedFuseA: Number.POSITIVE_INFINITY }, 'proposedFuseA'],
      [{ construction: 'braided' as 'solid' }, 'construction'],
      [{ rules: 'iso' as 'nec' }, 'rules'],
      [{ ambientC: 200 }, 'ambientC'],
      [{ bundledConductors: 2.5 }, 'bundledConductors'],
      [{ engineSpace: 'yes' as unknown as boolean }, 'engineSpace'],
      [{ fuseDistanceM: -0.1 }, 'fuseDistanceM'],
      [{ bank: { chemistry: 'nicd' as 'agm', capacityAh: 100 } }, 'bank.chemistry'],
      [{ bank: { chemistry: 'agm', capacityAh: 0 } }, 'bank.capacityAh'],
      [{ fuseInterruptingRatingA: -5 }, 'fuseInterruptingRatingA'],
    ];
    for (const [change, field] of bad) {
      expect(() => checkWireAndFuse({ ...charger, ...change })).toThrow(expect.objectContaining({ field }));
    }
    expect(() => checkWireAndFuse({ ...charger, currentA: 0 })).toThrow(
      'currentA must be greater than 0 A; got 0',
    );
    expect(() => checkWireAndFuse({ ...charger, systemVoltage: 36 as 12 })).toThrow(InstallerInputError);
  });

  it('carries the usual cautions', () => {
    // Common practice: fuse near the battery, protect the wire, DC arcs, local codes, not certification
    expect(WIRE_AND_FUSE_CAUTIONS.join(' ')).toMatch(
      /close to the battery[\s\S]*protects the wire[\s\S]*DC arcs/,
    );
    expect(WIRE_AND_FUSE_CAUTIONS.join(' ')).toMatch(
      /Local codes[\s\S]*licensed practice[\s\S]*not certification/,
    );
  });
});

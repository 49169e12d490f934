import { checkWireAndFuse, WIRE_AND_FUSE_CAUTIONS, WireFuseCheckInput } from './wire-fuse-check';
import { InstallerInputError } from './installer-input-error';

const charger: WireFuseCheckInput = {
  currentA: 60,
  oneWayLengthM: 2,
  systemVoltage: 12,
  allowedDropPercent: 3,
  insulationRatingC: 105,
};

const codes = (input: WireFuseCheckInput) => checkWireAndFuse(input).verdict.findings.map((f) => f.code);

describe('wire and fuse check', () => {
  it('sizes a 60 A charger 2 m from the battery at 12 V', () => {
    const result = checkWireAndFuse(charger);
    // By hand: 3 % of 12 V over 4 m at 60 A → ≤ 1.5 mΩ/m → ≥ 11.5 mm²: 6 AWG (13.3 mm², Wikipedia AWG table)
    expect(result.minimumGaugeByDrop).toBe('6');
    // NEC 210.19(A)(1) 125 % → 75 A; 33 CFR 183.425 Table 5, 105 °C: 8 AWG 80 A
    expect(result.minimumGaugeByAmpacity).toBe('8');
    expect(result).toMatchObject({ governingGauge: '6', governedBy: 'voltage-drop', checkedGauge: '6' });
    // 33 CFR 183.425 Table 5, 105 °C: 6 AWG 120 A; fuse from 125 % × 60 A = 75 A (NEC 210.20(A)) to 120 A
    expect(result.fuse).toEqual({ minimumA: 75, maximumA: 120, standardRatingsA: [80, 90, 100] });
    expect(result.verdict.ok).toBe(true);
  });

  it('accepts 4 AWG with a 90 A or a 100 A fuse for the 60 A charger', () => {
    for (const proposedFuseA of [90, 100]) {
      const result = checkWireAndFuse({ ...charger, proposedGauge: '4', proposedFuseA });
      // By hand: 60 A × 0.8152 mΩ/m × 4 m = 0.196 V = 1.63 % of 12 V, within 3 %
      expect(result.drop?.percent).toBeCloseTo(1.63, 2);
      // 33 CFR 183.425 Table 5, 105 °C: 4 AWG 160 A ≥ 100 A ≥ 90 A ≥ 75 A (125 % of 60 A)
      expect(result.ampacityA).toBe(160);
      expect(result.verdict).toEqual({ ok: true, findings: [] });
    }
  });

  it('still accepts both fuses on 4 AWG rated only 60 °C', () => {
    // ABYC E-11 60 °C column: 4 AWG 105 A, above both 90 A and 100 A
    expect(
      checkWireAndFuse({ ...charger, insulationRatingC: 60, proposedGauge: '4', proposedFuseA: 100 }).verdict
        .ok,
    ).toBe(true);
  });

  it('refuses a fuse larger than the wire can carry and a drop above the allowance', () => {
    const result = checkWireAndFuse({ ...charger, proposedGauge: '8', proposedFuseA: 90 });
    // 33 CFR 183.425 Table 5, 105 °C: 8 AWG 80 A < 90 A fuse; by hand 60 A × 2.061 mΩ/m × 4 m = 0.495 V = 4.1 % > 3 %
    expect(result.verdict.ok).toBe(false);
    expect(result.verdict.findings.map((f) => f.code)).toEqual(['drop-above-allowed', 'fuse-above-ampacity']);
    expect(result.verdict.findings[1].message).toBe(
      "a 90 A fuse exceeds 8 AWG's ampacity of 80 A: the wire could overheat before it opens",
    );
  });

  it('refuses a fuse that leaves no margin over the continuous current', () => {
    // NEC 210.20(A) continuous-load rule: a fuse ≥ 125 % × 60 A = 75 A; 70 A is below
    expect(codes({ ...charger, proposedGauge: '4', proposedFuseA: 70 })).toEqual([
      'fuse-below-continuous-margin',
    ]);
  });

  it('flags a wire too thin for the current and notes an uncommon fuse rating', () => {
    // 33 CFR 183.425 Table 5, 105 °C: 10 AWG 60 A < 75 A needed; 85 A is absent from the common DC ratings (common practice)
    expect(codes({ ...charger, oneWayLengthM: 0.3, proposedGauge: '10', proposedFuseA: 85 })).toEqual([
      'gauge-below-current',
      'fuse-above-ampacity',
      'fuse-rating-uncommon',
    ]);
  });

  it('reports when no common fuse lies between the load margin and the ampacity', () => {
    // NEC 210.20(A): 125 % × 350 A = 437.5 A; 33 CFR 183.425 Table 5, 105 °C: 4/0 445 A; the common DC ratings
    // (common practice) jump from 400 A to 500 A
    expect(codes({ ...charger, currentA: 350, oneWayLengthM: 0.2, proposedGauge: '4/0' })).toEqual([
      'no-fuse-fits',
    ]);
  });

  it('reports when no offered gauge is enough', () => {
    // 33 CFR 183.425 Table 5, 60 °C: 4/0 carries 300 A < 125 % × 300 A = 375 A; by hand 4/0 over 2 × 20 m
    // at 300 A loses 300 × 0.1608 mΩ/m × 40 m = 1.93 V = 16 % of 12 V
    const result = checkWireAndFuse({ ...charger, currentA: 300, oneWayLengthM: 20, insulationRatingC: 60 });
    expect(result.governingGauge).toBeUndefined();
    expect(result.verdict.findings.map((f) => f.code)).toEqual([
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

import { runWireFuseCheck, WireFuseFormValue } from './wire-fuse-adapter';

const base: WireFuseFormValue = {
  currentA: 20,
  oneWayLengthM: 3,
  systemVoltage: 12,
  allowedDropPercent: 3,
  insulationRatingC: 105,
  construction: 'stranded',
  conductorTemperatureC: 20,
  rules: 'marine',
  ambientC: 30,
  engineSpace: false,
  bundledConductors: 2,
  sheathed: false,
  fuseDistanceM: null,
  bankChemistry: 'lifepo4',
  bankCapacityAh: 100,
  proposedGauge: '',
  proposedFuseA: null,
  fuseInterruptingRatingA: null,
};

describe('runWireFuseCheck', () => {
  it('sizes a 20 A, 3 m run at 12 V and 3 % drop to 8 AWG, set by the drop', () => {
    const outcome = runWireFuseCheck(base);
    if (outcome.kind !== 'result') throw new Error(outcome.message);
    // By hand: allowed 0.36 V / 20 A / 6 m of copper → ≤ 3.0 mΩ/m; NEC Chapter 9 Table 8 stranded at 20 °C
    // (note 2, × 0.8224): 10 AWG 1.24 → 3.35 mΩ/m (too much), 8 AWG 0.778 → 2.10 mΩ/m → 8 AWG.
    expect(outcome.result.minimumGaugeByDrop).toBe('8');
    // ABYC E-11 ampacity, 105 °C column: 125 % × 20 A = 25 A → 16 AWG (25 A).
    expect(outcome.result.minimumGaugeByAmpacity).toBe('16');
    expect(outcome.result.governedBy).toBe('voltage-drop');
  });

  it('checks the proposed gauge instead of the recommended one', () => {
    const outcome = runWireFuseCheck({ ...base, proposedGauge: '12', proposedFuseA: 30 });
    if (outcome.kind !== 'result') throw new Error(outcome.message);
    expect(outcome.result.checkedGauge).toBe('12');
  });

  it('passes the new inputs through: an engine space derates and a far fuse fails', () => {
    const outcome = runWireFuseCheck({ ...base, engineSpace: true, fuseDistanceM: 0.5 });
    if (outcome.kind !== 'result') throw new Error(outcome.message);
    // 33 CFR 183.425(c), Table 5 note 1: 105 °C in an engine space × 0.86
    expect(outcome.result.deratings.map((d) => d.factor)).toEqual([0.86]);
    // 33 CFR 183.455(b): 0.5 m unsheathed is beyond 7 in (178 mm)
    expect(outcome.result.verdict.findings.map((f) => f.code)).toContain('fuse-too-far');
    // From memory (cell datasheets): 100 Ah LiFePO4 at 1.5 mΩ → 13.6 V / 1.5 mΩ ≈ 9,067 A
    expect(outcome.result.faultCurrentA).toBeCloseTo(9067, 0);
    const noBank = runWireFuseCheck({ ...base, bankChemistry: '' });
    expect(noBank.kind === 'result' && noBank.result.faultCurrentA).toBeUndefined();
  });

  it('names the refused field instead of throwing', () => {
    expect(runWireFuseCheck({ ...base, currentA: null })).toEqual(
      expect.objectContaining({ kind: 'refused', field: 'currentA' }),
    );
    expect(runWireFuseCheck({ ...base, ambientC: null })).toEqual(
      expect.objectContaining({ kind: 'refused', field: 'ambientC' }),
    );
  });
});

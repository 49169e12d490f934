import { runWireFuseCheck, WireFuseFormValue } from './wire-fuse-adapter';

const base: WireFuseFormValue = {
  currentA: 20,
  oneWayLengthM: 3,
  systemVoltage: 12,
  allowedDropPercent: 3,
  insulationRatingC: 105,
  proposedGauge: '',
  proposedFuseA: null,
};

describe('runWireFuseCheck', () => {
  it('sizes a 20 A, 3 m run at 12 V and 3 % drop to 8 AWG, set by the drop', () => {
    const outcome = runWireFuseCheck(base);
    if (outcome.kind !== 'result') throw new Error(outcome.message);
    // By hand: allowed 0.36 V / 20 A / 6 m of copper → ≥ (1/58 Ω·mm²/m, IEC 60028) / 0.003 Ω/m = 5.75 mm²;
    // ASTM B258 areas: 10 AWG 5.26 mm² (too thin), 8 AWG 8.37 mm² → 8 AWG.
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

  it('names the refused field instead of throwing', () => {
    expect(runWireFuseCheck({ ...base, currentA: null })).toEqual(
      expect.objectContaining({ kind: 'refused', field: 'currentA' }),
    );
  });
});

import fc from 'fast-check';
import { minimumGaugeByAmpacity, minimumGaugeByDrop, voltageDropFor } from './conductor-sizing';
import { AWG_SIZES } from './wire-gauge';

describe('conductor sizing', () => {
  it('expresses the drop as a share of the nominal voltage', () => {
    // Worked by hand: 60 A × 0.8152 mΩ/m × 4 m = 0.1956 V; 0.1956 / 12 = 1.63 %
    const drop = voltageDropFor('4', 60, 2, 12);
    expect(drop.volts).toBeCloseTo(0.1956, 4);
    expect(drop.percent).toBeCloseTo(1.63, 2);
  });

  it('picks the thinnest gauge within the allowed drop', () => {
    // By hand: 3 % of 12 V = 0.36 V over 2 × 3 m at 20 A → ≤ 3.0 mΩ/m → ≥ 0.017241/0.003 = 5.75 mm²;
    // 10 AWG is 5.26 mm² (too thin), 8 AWG 8.37 mm² (Wikipedia "American wire gauge" table)
    expect(minimumGaugeByDrop(20, 3, 12, 3)).toBe('8');
    // the same run at 24 V allows 0.72 V → ≥ 2.87 mm² → 12 AWG (3.31 mm²)
    expect(minimumGaugeByDrop(20, 3, 24, 3)).toBe('12');
  });

  it('finds no gauge when even 4/0 loses too much', () => {
    // By hand: 4/0 = 0.1608 mΩ/m; 400 A × 0.1608 mΩ/m × 40 m = 2.57 V = 21 % of 12 V
    expect(minimumGaugeByDrop(400, 20, 12, 3)).toBeUndefined();
  });

  it('sizes by ampacity at 125 % of the continuous current', () => {
    // NEC 210.19(A)(1): 60 A continuous needs 75 A; 33 CFR 183.425 Table 5, 105 °C: 10 AWG 60 A, 8 AWG 80 A
    expect(minimumGaugeByAmpacity(60, 105)).toBe('8');
    // same rule, 60 °C column: 8 AWG 55 A, 6 AWG 80 A
    expect(minimumGaugeByAmpacity(60, 60)).toBe('6');
  });

  it('always yields a gauge whose drop is within the allowance, and no thinner one would do', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.1, max: 500, noNaN: true }),
        fc.double({ min: 0.1, max: 30, noNaN: true }),
        fc.constantFrom(12, 24, 48),
        fc.double({ min: 0.5, max: 20, noNaN: true }),
        (current, length, voltage, allowed) => {
          const gauge = minimumGaugeByDrop(current, length, voltage, allowed);
          if (gauge === undefined) {
            expect(voltageDropFor('4/0', current, length, voltage).percent).toBeGreaterThan(allowed);
            return;
          }
          expect(voltageDropFor(gauge, current, length, voltage).percent).toBeLessThanOrEqual(allowed);
          const thinner = AWG_SIZES[AWG_SIZES.indexOf(gauge) - 1];
          if (thinner)
            expect(voltageDropFor(thinner, current, length, voltage).percent).toBeGreaterThan(allowed);
        },
      ),
    );
  });
});

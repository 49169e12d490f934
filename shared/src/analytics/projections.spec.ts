import { resolveBatterySetup } from './battery-setup';
import { hoursToEmpty, hoursToFull, projectStateOfCharge } from './projections';

const HOUR = 3_600_000;
const now = Date.UTC(2026, 11, 2, 19, 0);
const lithium = resolveBatterySetup({
  chemistry: 'lifepo4',
  nominalVoltage: 12,
  ratedCapacityAh: 100,
  usableCapacityAh: 100,
});
const half = { battery: lithium, stateOfCharge: 50, temperature: 25 };

describe('hoursToEmpty', () => {
  it('runs a constant 10 A load on 100 Ah from 50 % for 5 h', () => {
    // Arithmetic: 50 Ah remaining / 10 A = 5 h
    expect(hoursToEmpty(half, -10, 0)).toBeCloseTo(5, 9);
  });

  it('stops at the usable floor', () => {
    // Arithmetic: (50 − 20) % of 100 Ah = 30 Ah / 10 A = 3 h
    expect(hoursToEmpty(half, -10, 20)).toBeCloseTo(3, 9);
  });

  it('follows Peukert for lead-acid', () => {
    const flooded = resolveBatterySetup({
      chemistry: 'flooded',
      nominalVoltage: 12,
      ratedCapacityAh: 100,
      usableCapacityAh: 100,
    });
    // Peukert's law (Wikipedia "Peukert's law"): t = H·(C/(I·H))^k = 20·(100/200)^1.25 ≈ 8.41 h from full
    expect(hoursToEmpty({ battery: flooded, stateOfCharge: 100, temperature: 25 }, -10)).toBeCloseTo(
      20 * Math.pow(0.5, 1.25),
      9,
    );
  });

  it('gives no figure while charging or idle', () => {
    expect(hoursToEmpty(half, 5)).toBeUndefined();
    expect(hoursToEmpty(half, -0.01)).toBeUndefined();
  });
});

describe('hoursToFull', () => {
  it('fills the missing ampere-hours at the present current, less efficiency', () => {
    // Arithmetic: 50 Ah missing / (20 A × 0.99) ≈ 2.525 h
    expect(hoursToFull(half, 20)).toBeCloseTo(50 / 19.8, 9);
    expect(hoursToFull(half, -20)).toBeUndefined();
  });
});

describe('projectStateOfCharge', () => {
  it('projects the morning charge and when it crosses the low threshold', () => {
    const projection = projectStateOfCharge(half, -5, now, now + 12 * HOUR, 20);
    // Arithmetic: 5 A × 12 h = 60 Ah > the 50 Ah left, so empty by morning; 20 % is reached after 30 Ah / 5 A = 6 h
    expect(projection.stateOfCharge).toBe(0);
    expect(projection.crossesLowAt).toBe(now + 6 * HOUR);
  });

  it('reports no crossing when the charge stays above the threshold', () => {
    const projection = projectStateOfCharge(half, -1, now, now + 10 * HOUR, 20);
    // Arithmetic: 1 A × 10 h = 10 Ah → 40 %
    expect(projection.stateOfCharge).toBeCloseTo(40, 9);
    expect(projection.crossesLowAt).toBeNull();
  });

  it('caps a charging projection at 100 %', () => {
    expect(projectStateOfCharge(half, 30, now, now + 10 * HOUR, 20).stateOfCharge).toBe(100);
  });
});

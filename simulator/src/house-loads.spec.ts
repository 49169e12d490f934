import { fridgeDutyCycle, stepFridge } from './compressor-fridge';
import { initialLoadsState, inverterDcWatts, stepLoads } from './house-loads';
import { withinWindows } from './local-time';
import { mulberry32 } from './mulberry32';

describe('house loads', () => {
  it('draws AC watts / efficiency / voltage from the battery through the inverter', () => {
    const inverter = {
      efficiency: 0.9,
      idleWatts: 10,
      schedule: [{ from: 7, to: 22 }],
      acLoads: [{ watts: 900, schedule: [{ from: 7.5, to: 8 }] }],
    };
    // Conservation of energy across the inverter (general reference): P_dc = P_ac / η.
    expect(inverterDcWatts(inverter, 7.7)).toBeCloseTo(900 / 0.9 + 10, 9);
    expect(inverterDcWatts(inverter, 12)).toBe(10);
    expect(inverterDcWatts(inverter, 23)).toBe(0);
    const loads = { inverter };
    const step = stepLoads(
      initialLoadsState(loads),
      loads,
      { hour: 7.7, cabinTemperature: 20, busVoltage: 12.5 },
      10,
      mulberry32(1),
    );
    expect(step.current).toBeCloseTo((900 / 0.9 + 10) / 12.5, 9);
  });

  it('cycles the fridge at its duty cycle over a day', () => {
    const rng = mulberry32(3);
    const config = { watts: 45, onMinutes: 12 };
    let state = { running: false, remainingSeconds: 0 };
    let on = 0;
    let switches = 0;
    for (let t = 0; t < 24 * 3600; t += 10) {
      const next = stepFridge(state, config, 25, 10, rng);
      if (next.running !== state.running) switches++;
      state = next;
      if (state.running) on += 10;
    }
    expect(on / (24 * 3600)).toBeCloseTo(fridgeDutyCycle(25), 1);
    expect(switches).toBeGreaterThan(20);
  });

  it('keeps a standby drain inside its band with nothing switched on', () => {
    const loads = { drain: { minCurrent: 0.3, maxCurrent: 0.8 } };
    const rng = mulberry32(9);
    let state = initialLoadsState(loads);
    for (let t = 0; t < 24 * 3600; t += 10) {
      const step = stepLoads(state, loads, { hour: 3, cabinTemperature: 10, busVoltage: 12.7 }, 10, rng);
      expect(step.current).toBeGreaterThanOrEqual(0.3);
      expect(step.current).toBeLessThanOrEqual(0.8);
      state = step.state;
    }
  });

  it('wraps a daily window past midnight', () => {
    expect(withinWindows([{ from: 22, to: 6 }], 23)).toBe(true);
    expect(withinWindows([{ from: 22, to: 6 }], 5.9)).toBe(true);
    expect(withinWindows([{ from: 22, to: 6 }], 12)).toBe(false);
  });
});

import {
  AirHeaterConfig,
  AirHeaterState,
  HEATER_GLOW_SECONDS,
  heaterWatts,
  stepAirHeater,
} from './air-heater';
import { ALWAYS } from './local-time';

const config: AirHeaterConfig = { schedule: ALWAYS, setpoint: 18, hysteresis: 1.5 };

describe('air heater', () => {
  it('surges with its glow plug for the start-up, then draws a small steady current', () => {
    let state: AirHeaterState = { phase: 'off', phaseSeconds: 0 };
    const amps: number[] = [];
    for (let t = 0; t < 300; t += 10) {
      state = stepAirHeater(state, config, 10, 12, 10);
      amps.push(heaterWatts(state) / 12);
    }
    // Common practice for a 2 kW diesel air heater at 12 V: ~8–10 A glow plug for 1–2 min, then ~1–2 A.
    const surge = amps.filter((a) => a > 5);
    expect(surge.length * 10).toBe(HEATER_GLOW_SECONDS);
    for (const a of surge) expect(a).toBeGreaterThanOrEqual(8);
    expect(amps[amps.length - 1]).toBeGreaterThanOrEqual(1);
    expect(amps[amps.length - 1]).toBeLessThanOrEqual(2);
  });

  it('switches off above the band and stays off outside its schedule', () => {
    const running: AirHeaterState = { phase: 'run', phaseSeconds: 600 };
    expect(stepAirHeater(running, config, 19.6, 12, 10).phase).toBe('off');
    expect(stepAirHeater(running, config, 18, 12, 10).phase).toBe('run');
    const evenings = { ...config, schedule: [{ from: 17, to: 23 }] };
    expect(stepAirHeater({ phase: 'off', phaseSeconds: 0 }, evenings, 5, 12, 10).phase).toBe('off');
    expect(stepAirHeater({ phase: 'off', phaseSeconds: 0 }, evenings, 5, 18, 10).phase).toBe('glow');
  });
});

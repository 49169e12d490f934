import { CHEMISTRY_PROFILES, validateReading } from '@cellwarden/shared';
import { ENGINE_RUNS, SCENARIO_SUMMARIES, SCENARIOS } from './scenario-catalog';
import { localHour, withinWindows } from './local-time';
import { simulateReadings } from './simulate-readings';

const options = { seed: 7, start: Date.UTC(2026, 0, 10, 18), intervalSeconds: 60, count: 12 * 60 };
const play = (name: string, overrides: Partial<typeof options> = {}) =>
  simulateReadings(SCENARIOS[name], { ...options, ...overrides });

describe('simulateReadings', () => {
  it('gives identical readings for the same seed and different ones for another', () => {
    expect(play('frost-night')).toEqual(play('frost-night'));
    expect(play('frost-night', { seed: 8 }).readings).not.toEqual(play('frost-night').readings);
  });

  it('returns exactly count readings with their own measured times', () => {
    const { readings } = play('driving-day', { count: 5 });
    expect(readings.map((r) => r.measuredAt - options.start)).toEqual([0, 60e3, 120e3, 180e3, 240e3]);
  });

  it.each(Object.keys(SCENARIOS))('%s produces readings the server accepts', (name) => {
    const { readings } = play(name, { count: 24 * 60 });
    for (const reading of readings) validateReading(reading, { now: options.start + 2 * 86_400_000 });
  });

  it('cools the frost-night pack below 0 °C while the unprotected charger keeps pushing current', () => {
    const { readings, truth } = play('frost-night');
    const coldCharging = readings.filter((r) => r.temperature < 0 && r.current > 0);
    expect(coldCharging.length).toBeGreaterThan(60);
    expect(Math.min(...truth.map((t) => t.ambientTemperature))).toBeLessThan(-10);
    expect(truth.some((t) => t.packTemperature < 0 && t.coldChargeBlocked)).toBe(false);
    expect(coldCharging.every((r) => (r.sourceCurrents?.shore ?? 0) > 0)).toBe(true);
  });

  it('cycles the frost-night heater, with its glow-plug surge at each start', () => {
    const { truth } = play('frost-night', { intervalSeconds: 10, count: 6 * 360 });
    const starts = truth.filter((t, i) => i > 0 && t.heaterRunning && !truth[i - 1].heaterRunning);
    expect(starts.length).toBeGreaterThan(2);
    // The glow plug (≈ 9 A at 12 V, common practice) lifts the load well above the ~1.5 A running draw.
    expect(Math.max(...truth.map((t) => t.loadCurrent))).toBeGreaterThan(8);
  });

  it('keeps the same scenario from charging below 0 °C when its BMS has the protection', () => {
    const protectedNight = {
      ...SCENARIOS['frost-night'],
      bms: { ...SCENARIOS['frost-night'].bms, blocksColdCharge: true },
    };
    const { truth } = simulateReadings(protectedNight, options);
    const cold = truth.filter((t) => t.packTemperature < CHEMISTRY_PROFILES.lifepo4.minimumChargeTemperature);
    expect(cold.length).toBeGreaterThan(0);
    for (const t of cold) expect(t.packCurrent).toBeLessThanOrEqual(0);
  });

  it('takes the driving-day pack from bulk into absorption on the DC-DC charger', () => {
    const { truth } = play('driving-day', { start: Date.UTC(2026, 6, 10, 5), count: 10 * 60 });
    const stages = truth.map((t) => t.sources.dcdc.stage).filter((s, i, all) => s !== all[i - 1]);
    expect(stages.slice(0, 3)).toEqual(['off', 'bulk', 'absorption']);
    const bulk = truth.filter((t) => t.sources.dcdc.stage === 'bulk');
    for (const t of bulk) expect(t.sources.dcdc.current).toBeCloseTo(30, 6);
  });

  it('holds the commissioning charger at its 60 A rating in bulk while the engine runs, and nothing while it rests', () => {
    const rating = SCENARIO_SUMMARIES.find((s) => s.name === 'charger-commissioning')?.chargeSources[0];
    expect(rating).toEqual({ id: 'dcdc', kind: 'dcdc', ratedCurrent: 60 });
    const { readings, truth } = play('charger-commissioning', { count: 120 });
    const { longitude } = SCENARIOS['charger-commissioning'].location;
    const running = readings.map((r) => withinWindows(ENGINE_RUNS, localHour(r.measuredAt, longitude)));
    expect(running.filter(Boolean).length).toBeGreaterThan(80);
    expect(running.filter((r) => !r).length).toBeGreaterThan(20);
    truth.forEach((t, i) => expect(t.sources.dcdc.stage).toBe(running[i] ? 'bulk' : 'off'));
    readings.forEach((r, i) => expect(r.sourceCurrents?.dcdc).toBeCloseTo(running[i] ? 60 : 0, 0));
  });

  it('keeps the commissioning pack in the middle for days, so the DC-DC check finds bulk whenever the engine runs', () => {
    const { trueStateOfCharge } = play('charger-commissioning', { count: 4 * 24 * 60 });
    expect(Math.min(...trueStateOfCharge)).toBeGreaterThan(35);
    expect(Math.max(...trueStateOfCharge)).toBeLessThan(85);
  });

  it('gives less than the rating through the thin cable and drops more voltage than the commissioning install', () => {
    // Ten minutes in, 18:10 UTC is 18:30 local mean time at 5.1° E: both engines are running.
    const drop = (name: string) => {
      const t = play(name, { count: 30 }).truth[10];
      return { current: t.sources.dcdc.current, drop: t.sources.dcdc.outputVoltage - t.busVoltage };
    };
    const good = drop('charger-commissioning');
    const thin = drop('thin-cable');
    expect(good.current).toBeCloseTo(60, 0);
    expect(thin.current).toBeLessThan(0.6 * 60);
    expect(thin.drop).toBeGreaterThan(2 * good.drop);
    expect(thin.drop).toBeGreaterThan(0.5);
  });

  it('empties the phantom-drain bank with no loads scheduled', () => {
    const scenario = SCENARIOS['phantom-drain'];
    expect(Object.keys(scenario.loads)).toEqual(['drain']);
    const { readings, trueStateOfCharge } = play('phantom-drain', { count: 24 * 60 });
    expect(trueStateOfCharge[trueStateOfCharge.length - 1]).toBeLessThan(trueStateOfCharge[0] - 3);
    const mean = readings.reduce((sum, r) => sum + r.current, 0) / readings.length;
    expect(mean).toBeLessThan(-0.25);
    expect(mean).toBeGreaterThan(-0.85);
  });

  it('cuts the flat-by-morning pack at its low-voltage limit: current to zero, voltage recovers', () => {
    const { readings, truth } = play('flat-by-morning', { start: Date.UTC(2026, 2, 10, 15), count: 8 * 60 });
    const cut = truth.findIndex((t) => t.dischargeCut);
    expect(cut).toBeGreaterThan(0);
    const cutoff = CHEMISTRY_PROFILES.lifepo4.lowVoltageCutoff * 2;
    expect(Math.min(...readings.slice(0, cut + 1).map((r) => r.voltage))).toBeLessThan(cutoff + 0.3);
    for (const t of truth.slice(cut)) expect(t.packCurrent).toBe(0);
    for (const r of readings.slice(cut + 1)) expect(Math.abs(r.current)).toBeLessThan(0.15);
    expect(readings[cut + 2].voltage).toBeGreaterThan(readings[cut - 1].voltage);
  });

  it('balances: the integral of pack current equals the change of stored charge', () => {
    // Charge conservation (general reference): Σ I·η·Δt = ΔSoC × capacity, at the workshop's steady 20 °C, over
    // 40 minutes of one engine run (17:40 UTC is 18:00 local mean time at 5.1° E), when the pack only charges.
    const efficiency = CHEMISTRY_PROFILES.lifepo4.chargeEfficiency;
    const start = Date.UTC(2026, 0, 10, 17, 40);
    const { truth } = play('charger-commissioning', { start, count: 40, intervalSeconds: 60 });
    expect(truth.every((t) => t.packCurrent > 0)).toBe(true);
    const integralAh = truth
      .slice(1)
      .reduce((sum, t) => sum + (t.packCurrent > 0 ? t.packCurrent * efficiency : t.packCurrent) / 60, 0);
    const deltaAh = ((truth[39].stateOfCharge - truth[0].stateOfCharge) / 100) * 200;
    expect(deltaAh).toBeCloseTo(integralAh, 1);
  });

  it("lets the monitor's own state of charge drift only a little from the truth", () => {
    const { readings, trueStateOfCharge } = play('driving-day', { start: Date.UTC(2026, 6, 10, 5) });
    expect(readings[0].stateOfCharge).toBeCloseTo(trueStateOfCharge[0], 0);
    const last = readings.length - 1;
    expect(Math.abs((readings[last].stateOfCharge ?? 0) - trueStateOfCharge[last])).toBeLessThan(5);
  });

  it('reads the same bank through a second monitor: the same truth, its own small calibration errors', () => {
    const lead = play('flat-by-morning', { count: 600 });
    const second = simulateReadings(SCENARIOS['flat-by-morning'], {
      ...options,
      count: 600,
      monitorSeed: 99,
    });
    expect(second.truth).toEqual(lead.truth);
    expect(second.readings).not.toEqual(lead.readings);
    lead.readings.forEach((r, i) => {
      const other = second.readings[i];
      expect(other.measuredAt).toBe(r.measuredAt);
      // Two monitors within their stated bias and noise (battery-monitor.ts): ±(5 + 4) mV and ±(0.05 + 0.03) A
      // each, so they differ by at most twice that.
      expect(Math.abs(other.voltage - r.voltage)).toBeLessThanOrEqual(0.019);
      expect(Math.abs(other.current - r.current)).toBeLessThanOrEqual(0.17);
    });
  });
});

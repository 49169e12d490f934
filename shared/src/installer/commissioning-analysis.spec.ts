import type { BatteryReading } from '../telemetry/reading';
import { analyzeCommissioning } from './commissioning-analysis';
import { commissioningProgress, feedCommissioning, startCommissioning } from './commissioning-tracker';

const T0 = Date.UTC(2026, 4, 1, 9);
const RAMP = [0, 0, 10, 25, 40, 55];

/** One reading a second; the battery voltage creeps up as bulk charging does. */
function window(currents: readonly number[], extra: Partial<BatteryReading> = {}): BatteryReading[] {
  return currents.map((current, i) => ({
    measuredAt: T0 + i * 1000,
    voltage: 13.2 + i * 0.002,
    current,
    temperature: 20,
    ...extra,
  }));
}

/** `seconds` readings alternating level ± swing, so the mean is exactly `level`. */
function steady(level: number, seconds: number, swing = 0): number[] {
  return Array.from({ length: seconds }, (_, i) => level + (i % 2 === 0 ? swing : -swing));
}

const rated = { ratedCurrentA: 60 };

describe('commissioning analysis', () => {
  it('passes a charger delivering its rating after the ramp-up', () => {
    const result = analyzeCommissioning(window([...RAMP, ...steady(59.5, 80, 0.5)]), rated);
    expect(result.verdict.ok).toBe(true);
    // By hand: the ramp restarts the run until 55 A (t = 5 s); 10 s of settling, then t = 15…75 s measured
    expect(result.bulk).toMatchObject({
      startedAt: T0 + 15_000,
      endedAt: T0 + 75_000,
      seconds: 60,
      samples: 61,
    });
    // By hand: of the 61 samples 31 read 59 A and 30 read 60 A → mean 3,629 / 61 = 59.49 A
    expect(result.bulk).toMatchObject({ minCurrentA: 59, maxCurrentA: 60, ripplePeakToPeakA: 1 });
    expect(result.bulk?.meanCurrentA).toBeCloseTo(3629 / 61, 9);
    // Bernoulli variance (general reference): σ = (a − b)·√(p(1 − p)) = 1 A × √(31 × 30) / 61 = 0.49996 A
    expect(result.bulk?.rippleStandardDeviationA).toBeCloseTo(Math.sqrt(31 * 30) / 61, 9);
    expect(result.verdict.findings).toEqual([
      {
        severity: 'info',
        code: 'within-rating',
        message: 'mean 59.5 A is 1 % from the 60 A rating (tolerance 10 %)',
      },
    ]);
  });

  it('fails a charger that under-delivers, quoting the shortfall', () => {
    const result = analyzeCommissioning(window([...RAMP.slice(0, 4), ...steady(52.1, 80, 0.3)]), rated);
    // By hand: (60 − 52.1) / 60 = 13.2 %, beyond the 10 % tolerance
    expect(result.verdict.ok).toBe(false);
    expect(result.verdict.findings.map((f) => f.message)).toEqual([
      'mean 52.1 A is 13 % below the 60 A rating (tolerance 10 %)',
    ]);
  });

  it('fails a charger above its rating', () => {
    const result = analyzeCommissioning(window(steady(70, 80)), rated);
    // By hand: (70 − 60) / 60 = 16.7 % above
    expect(result.verdict.findings[0]).toMatchObject({ code: 'above-rating' });
  });

  it('finds no bulk phase when the current tapers straight away', () => {
    // A nearly full battery: the current peaks and decays with a 15 s time constant (invented window)
    const taper = Array.from({ length: 120 }, (_, i) => 60 * Math.exp(-i / 15));
    const result = analyzeCommissioning(window([...RAMP, ...taper]), rated);
    expect(result.verdict.ok).toBe(false);
    expect(result.verdict.findings[0].code).toBe('no-settled-bulk');
    expect(result.verdict.findings[0].message).toMatch(
      /^no settled bulk phase found.*: the battery may be nearly full — discharge it first$/,
    );
  });

  it('asks for more time when the window ends while the current is still steady', () => {
    const result = analyzeCommissioning(window(steady(60, 40)), rated);
    // By hand: 40 readings, 10 s settling → t = 10…39 s measured, 29 s of the 60 s needed
    expect(result.verdict.findings.map((f) => f.code)).toEqual(['measurement-incomplete']);
    expect(result.bulk?.seconds).toBe(29);
  });

  it('says so when the source never delivers', () => {
    const result = analyzeCommissioning(window(steady(2, 90)), { ...rated, sourceId: 'dcdc' });
    expect(result.bulk).toBeUndefined();
    expect(result.verdict.findings[0].message).toBe(
      "no charge current above 6 A was seen: check the source is running and that it reports as 'dcdc'",
    );
  });

  it('measures ripple and warns when the current swings', () => {
    const result = analyzeCommissioning(window(steady(60, 80, 4)), rated);
    // By hand: samples alternate 64 and 56 A → peak to peak 8 A, above 10 % of 60 A
    expect(result.bulk?.ripplePeakToPeakA).toBe(8);
    // Bernoulli variance (general reference): 31 of 61 samples at 64 A → σ = 8 A × √(31 × 30) / 61 = 3.9995 A
    expect(result.bulk?.rippleStandardDeviationA).toBeCloseTo((8 * Math.sqrt(31 * 30)) / 61, 9);
    expect(result.verdict.ok).toBe(true);
    expect(result.verdict.findings.map((f) => f.code)).toEqual(['current-unsteady', 'within-rating']);
  });

  it('uses the source current when the readings carry it', () => {
    // The pack sees 25 A because loads take 5 A of the charger's 30 A
    const readings = window(steady(25, 80), { sourceCurrents: { dcdc: 30 } });
    const result = analyzeCommissioning(readings, { ratedCurrentA: 30, sourceId: 'dcdc' });
    expect(result.bulk?.meanCurrentA).toBe(30);
    expect(analyzeCommissioning(readings, { ratedCurrentA: 30 }).bulk?.meanCurrentA).toBe(25);
  });

  it('gives the cable drop from two measured voltages, or estimates it from gauge and length', () => {
    const readings = window(steady(60, 80));
    const measured = analyzeCommissioning(readings, {
      ...rated,
      sourceOutputVoltage: 14.4,
      batteryTerminalVoltage: 13.8,
    });
    // By hand: 14.4 − 13.8 = 0.6 V = 4.17 % of 14.4 V, above the 3 % common practice for charge circuits
    expect(measured.cableDrop).toEqual({
      volts: expect.closeTo(0.6, 9),
      percent: expect.closeTo(4.167, 3),
      method: 'measured',
    });
    expect(measured.verdict.findings.map((f) => f.code)).toEqual(['cable-drop-high', 'within-rating']);
    const estimated = analyzeCommissioning(readings, { ...rated, gauge: '4', oneWayLengthM: 2 });
    // By hand: 60 A × 0.8152 mΩ/m (Wikipedia AWG table) × 4 m = 0.196 V
    expect(estimated.cableDrop).toMatchObject({ volts: expect.closeTo(0.1956, 4), method: 'estimated' });
  });

  it('restarts the steady run after a gap in the readings', () => {
    const readings = window([...steady(60, 100), 0]).filter((_, i) => i < 40 || i >= 75);
    const result = analyzeCommissioning(readings, rated);
    // By hand: 35 s gap > 30 s: two runs of 40 and 25 readings, each settling 10 s, so at most 29 s measured;
    // the source then stops
    expect(result.verdict.findings[0].code).toBe('no-settled-bulk');
    expect(result.bulk?.seconds).toBe(29);
  });

  it('reports progress reading by reading', () => {
    const readings = window([...RAMP, ...steady(60, 80)]);
    let state = startCommissioning(rated);
    const phases = readings.map((r) => {
      state = feedCommissioning(state, r);
      return commissioningProgress(state);
    });
    expect(phases[0]).toEqual({ phase: 'waiting-for-current', secondsMeasured: 0, secondsNeeded: 60 });
    expect(phases[3].phase).toBe('settling');
    expect(phases[20]).toEqual({ phase: 'measuring', secondsMeasured: 5, secondsNeeded: 60 });
    expect(phases[75]).toEqual({ phase: 'done', secondsMeasured: 60, secondsNeeded: 60 });
    // A finished test keeps its state whatever follows
    expect(feedCommissioning(state, { ...readings[0], measuredAt: T0 + 999_000, current: 0 })).toBe(state);
  });

  it('keeps a state that does not grow with the number of readings', () => {
    const long = window(steady(30, 10_000, 1));
    const options = { ...rated, measureSeconds: 3600 };
    const after = (n: number) =>
      JSON.stringify(long.slice(0, n).reduce(feedCommissioning, startCommissioning(options)));
    expect(after(10_000).length).toBeLessThan(after(100).length + 100);
  });

  it('names the field of bad options and readings', () => {
    expect(() => startCommissioning({ ratedCurrentA: 0 })).toThrow(
      expect.objectContaining({ field: 'ratedCurrentA' }),
    );
    expect(() => startCommissioning({ ...rated, tolerancePercent: 80 })).toThrow(
      expect.objectContaining({ field: 'tolerancePercent' }),
    );
    expect(() => startCommissioning({ ...rated, gauge: '5' as '4' })).toThrow(
      expect.objectContaining({ field: 'gauge' }),
    );
    const [first, second] = window([60, 60]);
    expect(() => analyzeCommissioning([second, first], rated)).toThrow(
      expect.objectContaining({ field: 'measuredAt' }),
    );
    expect(() => analyzeCommissioning([{ ...first, current: Number.NaN }], rated)).toThrow(
      expect.objectContaining({ field: 'current' }),
    );
  });
});

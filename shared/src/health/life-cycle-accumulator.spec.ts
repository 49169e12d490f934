import { AnalyticsSettingError } from '../analytics/analytics-error';
import { HourSummary } from './health-types';
import { createLifeCycleAccumulator } from './life-cycle-accumulator';

const HOUR = 3_600_000;
const T0 = Date.UTC(2026, 0, 1);

function hour(index: number, values: Partial<HourSummary>): HourSummary {
  return {
    start: T0 + index * HOUR,
    ahIn: 0,
    ahOut: 0,
    whIn: 0,
    whOut: 0,
    temperatureMin: 20,
    temperatureMax: 20,
    temperatureMean: 20,
    readingCount: 60,
    ...values,
  };
}

function figuresOf(hours: readonly HourSummary[], usableAh = 100) {
  const accumulator = createLifeCycleAccumulator(usableAh);
  for (const h of hours) accumulator.push(h);
  return accumulator.figures();
}

describe('life-cycle accumulator', () => {
  const oneCycle = [
    hour(0, { ahIn: 10, whIn: 140, socLast: 100 }),
    hour(1, { ahOut: 20, whOut: 260, socLast: 80 }),
    hour(2, { ahOut: 30, whOut: 390, socLast: 50 }),
    hour(3, { ahIn: 50, whIn: 700, socLast: 100 }),
  ];

  it('sums energy and throughput and counts equivalent full cycles as Ah out ÷ usable Ah', () => {
    const f = figuresOf(oneCycle);
    expect([f.ahIn, f.ahOut, f.whIn, f.whOut, f.hoursCovered]).toEqual([60, 50, 840, 650, 4]);
    expect(f.equivalentFullCycles).toBeCloseTo(0.5, 12);
  });

  it('takes the round-trip efficiency from full to full only', () => {
    // From the full hour 0 to the full hour 3: 650 Wh out for 700 Wh in.
    expect(figuresOf(oneCycle).chargeEfficiency).toBeCloseTo(650 / 700, 12);
    expect(figuresOf(oneCycle.slice(0, 3)).chargeEfficiency).toBeUndefined();
  });

  it('counts a discharge from full to half and back as one 50 % cycle', () => {
    // Rainflow (ASTM E1049-85 §5.4.4, from memory): 100 → 50 → 100 gives two half cycles of range 50.
    const f = figuresOf(oneCycle);
    const counted = f.depthOfDischarge.filter((d) => d.cycles > 0);
    expect(counted).toEqual([{ fromPercent: 50, toPercent: 60, cycles: 1 }]);
    expect(f.depthOfDischarge).toHaveLength(10);
  });

  it("counts hours in temperature bands from each hour's mean", () => {
    const means = [-5, 0, 9.9, 10, 34.9, 35, 45, 45.1];
    const f = figuresOf(
      means.map((t, i) => hour(i, { temperatureMean: t, temperatureMin: t, temperatureMax: t })),
    );
    expect(f.temperatureHours).toEqual([
      { band: 'below-0', hours: 1 },
      { band: '0-10', hours: 2 },
      { band: '10-35', hours: 2 },
      { band: '35-45', hours: 2 },
      { band: 'above-45', hours: 1 },
    ]);
  });

  it('merges consecutive cold-charging hours into one episode and ignores a trickle', () => {
    const f = figuresOf([
      hour(0, { ahIn: 5, temperatureMin: -3, temperatureMax: 1, temperatureMean: -1 }),
      hour(1, { ahIn: 4, temperatureMin: -6, temperatureMax: -2, temperatureMean: -4 }),
      hour(2, { ahIn: 3, temperatureMin: 2, temperatureMax: 4, temperatureMean: 3 }),
      hour(3, { ahIn: 0.1, temperatureMin: -8, temperatureMax: -7, temperatureMean: -7.5 }),
      hour(5, { ahIn: 2, temperatureMin: -2, temperatureMax: -1, temperatureMean: -1.5 }),
    ]);
    expect(f.coldCharging).toEqual([
      { start: T0, end: T0 + 2 * HOUR, ahIn: 9, lowestTemperature: -6, highestTemperature: 1 },
      { start: T0 + 5 * HOUR, end: T0 + 6 * HOUR, ahIn: 2, lowestTemperature: -2, highestTemperature: -1 },
    ]);
    expect(f.hotCharging).toEqual([]);
  });

  it('records charging above 45 °C and hours kept nearly full while hot', () => {
    const f = figuresOf([
      hour(0, {
        ahIn: 8,
        temperatureMin: 40,
        temperatureMax: 47,
        temperatureMean: 44,
        socMax: 95,
        socLast: 95,
      }),
      hour(1, { temperatureMin: 34, temperatureMax: 36, temperatureMean: 35, socMax: 90, socLast: 89 }),
      hour(2, { temperatureMin: 34, temperatureMax: 36, temperatureMean: 35, socMax: 89, socLast: 89 }),
    ]);
    expect(f.hotCharging).toHaveLength(1);
    expect(f.hotCharging[0].ahIn).toBe(8);
    expect(f.hotAtHighChargeHours).toBe(2);
  });

  it('ignores hours without readings, replayed hours and malformed ones', () => {
    const noisy = [
      oneCycle[0],
      hour(0, { ahIn: 99 }),
      hour(1, { ahIn: 99, readingCount: 0 }),
      oneCycle[1],
      hour(1.5, { ahIn: Number.NaN }),
      oneCycle[2],
      oneCycle[3],
    ];
    expect(figuresOf(noisy)).toEqual(figuresOf(oneCycle));
  });

  it('resumes from its JSON state with the same figures as an uninterrupted run', () => {
    const hours = Array.from({ length: 500 }, (_, i) =>
      hour(i, {
        ahIn: i % 7 === 0 ? 20 : 0,
        ahOut: i % 7 === 0 ? 0 : 3 + (i % 5),
        whIn: i % 7 === 0 ? 270 : 0,
        whOut: i % 7 === 0 ? 0 : 40,
        temperatureMin: -10 + (i % 40),
        temperatureMax: -5 + (i % 40),
        temperatureMean: -7 + (i % 40),
        socLast: 50 + 45 * Math.sin(i / 9) * Math.cos(i / 31),
      }),
    );
    const whole = figuresOf(hours);
    for (const cut of [1, 77, 250, 499]) {
      const first = createLifeCycleAccumulator(100);
      hours.slice(0, cut).forEach((h) => first.push(h));
      const resumed = createLifeCycleAccumulator(100, JSON.parse(JSON.stringify(first.state())));
      hours.slice(cut).forEach((h) => resumed.push(h));
      expect(resumed.figures()).toEqual(whole);
    }
    expect(whole.coldCharging.length).toBeGreaterThan(0);
  });

  it('refuses a usable capacity no battery has', () => {
    expect(() => createLifeCycleAccumulator(0)).toThrow(AnalyticsSettingError);
  });
});

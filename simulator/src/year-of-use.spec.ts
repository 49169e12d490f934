import {
  BatterySetup,
  CapacitySample,
  capacityTrend,
  createCapacityTracker,
  createLifeCycleAccumulator,
  hoursOf,
  LifeCycleFigures,
  MinuteSummary,
} from '@cellwarden/shared';
import { SimulatedMinute, yearOfUse, YearOfUseOptions } from './year-of-use';
import { emptyTally, straightLifeCycleFigures, tallyMinute } from './year-of-use-straight-figures';

const DEMO_START = Date.UTC(2025, 11, 1);
const DEMO_SETUP: BatterySetup = {
  chemistry: 'lifepo4',
  nominalVoltage: 12,
  ratedCapacityAh: 200,
  usableCapacityAh: 200,
};
const DAY = 86_400_000;
const SLOW = 300_000;

function firstMinutes(options: YearOfUseOptions, count: number): SimulatedMinute[] {
  const out: SimulatedMinute[] = [];
  for (const item of yearOfUse(options)) {
    out.push(item);
    if (out.length === count) break;
  }
  return out;
}

describe('year of use', () => {
  it('gives the same minutes for the same seed and different ones for another', () => {
    const options = { seed: 11, start: DEMO_START, days: 2 };
    const again = firstMinutes(options, 2880);
    expect(firstMinutes(options, 2880)).toEqual(again);
    expect(firstMinutes({ ...options, seed: 12 }, 2880)).not.toEqual(again);
  });

  it('yields whole consecutive minutes, each with the truth beside it', () => {
    const minutes = firstMinutes({ seed: 1, start: DEMO_START + 1234, days: 1 }, 2000);
    expect(minutes).toHaveLength(1440);
    minutes.forEach(({ minute }, i) => expect(minute.start).toBe(DEMO_START + i * 60_000));
    for (const { minute, truth } of minutes) {
      expect(minute.ahIn * minute.ahOut).toBe(0);
      expect(truth.capacityAh).toBeLessThanOrEqual(204);
      expect(truth.stateOfCharge).toBeGreaterThanOrEqual(0);
    }
  });

  describe('the demo year', () => {
    const year = runDemoYear();

    it('fades a few percent over the year and never gains capacity back', () => {
      const lost = 1 - year.truthAtEnd / 204;
      expect(lost).toBeGreaterThan(0.015);
      expect(lost).toBeLessThan(0.06);
      expect(year.capacityEverRose).toBe(false);
      expect(year.minutes).toBe(365 * 1440);
    });

    it('charges below 0 °C on exactly two winter nights, and the life-cycle figures find both', () => {
      expect(year.incremental.coldCharging).toHaveLength(2);
      for (const episode of year.incremental.coldCharging) {
        expect(episode.ahIn).toBeGreaterThan(5);
        expect(new Date(episode.start).getUTCMonth()).toBe(0);
      }
      expect(year.incremental.hotCharging).toEqual([]);
    });

    it('lets the estimator recover the true capacity within its uncertainty, and within 3 % at the end', () => {
      // Weekly full charges give a sample nearly every week.
      expect(year.samples.length).toBeGreaterThan(45);
      for (const [i, sample] of year.samples.entries()) {
        expect(Math.abs(sample.usableAh - year.truthAtSample[i])).toBeLessThan(3 * sample.sigmaAh);
      }
      const { current } = capacityTrend(year.samples, 200, 'Europe/Oslo');
      expect(Math.abs((current?.usableAh ?? 0) / year.truthAtEnd - 1)).toBeLessThan(0.03);
      expect(Math.abs((current?.usableAh ?? 0) - year.truthAtEnd)).toBeLessThan(2 * (current?.sigmaAh ?? 0));
    });

    it('follows the fade month by month', () => {
      const trend = capacityTrend(year.samples, 200, 'Europe/Oslo');
      // The coldest month may have none: the BMS's cold lock keeps the bank from a full charge for weeks.
      expect(trend.months.length).toBeGreaterThanOrEqual(11);
      for (const month of trend.months) {
        const truth = year.truthAround(month.monthStart + 15 * DAY);
        expect(Math.abs(month.usableAh / truth - 1)).toBeLessThan(0.03);
      }
      expect(trend.months[trend.months.length - 1].usableAh).toBeLessThan(trend.months[0].usableAh - 3);
    });

    it('gives the same life-cycle figures hour by hour as a straight computation from the minutes', () => {
      expectSameFigures(year.incremental, year.straight);
      expect(year.incremental.hoursCovered).toBe(8760);
    });

    it('gives the same samples and figures when resumed from a mid-year state', () => {
      expect(year.resumedSamples).toEqual(year.samples.filter((s) => s.at > year.resumedAt));
      expect(year.resumedFigures).toEqual(year.incremental);
    });
  });
});

const WARM = { meanTemperature: 27, seasonalSwing: 3, dailySwing: 4, coldestDayOfYear: 20 };
const SPRING = Date.UTC(2026, 2, 1);
const LEAD_ACID_USE = {
  fullChargeEveryDays: 7,
  restStateOfCharge: [0.3, 0.5] as const,
  solarPeakCurrent: 15,
  shoreChargerCurrent: 40,
};

// Eight weeks each. Errors reached (seeds 1–3, present estimate against truth): LiFePO4 24 V warm +1.3…+1.8 %
// (σ 3.4 %); every 3 days with a +0.05 A offset −0.5…−0.7 % (σ 1.2 %); weekly with −0.05 A +2.4…+2.5 % (σ 2.3 %);
// AGM +0.9…+1.0 % (σ 3.1 %); flooded 48 V +0.9…+1.0 % (σ 1.5 %). The sensor's zero offset dominates.
const ACCURACY_CASES: [string, BatterySetup, Omit<YearOfUseOptions, 'seed' | 'start' | 'days'>][] = [
  [
    'LiFePO4 24 V 100 Ah in a warm climate, weekly full charges',
    { chemistry: 'lifepo4', nominalVoltage: 24, ratedCapacityAh: 100, usableCapacityAh: 100 },
    { pack: { chemistry: 'lifepo4', nominalVoltage: 24, ratedCapacityAh: 100 }, climate: WARM },
  ],
  [
    'LiFePO4 12 V 200 Ah charged full every 3 days, monitor reading 0.05 A high',
    DEMO_SETUP,
    {
      sensorBias: { current: 0.05 },
      usage: {
        fullChargeEveryDays: 3,
        restStateOfCharge: [0.02, 0.2],
        solarPeakCurrent: 15,
        shoreChargerCurrent: 40,
      },
    },
  ],
  [
    'LiFePO4 12 V 200 Ah in spring, weekly, monitor reading 0.05 A low',
    DEMO_SETUP,
    { sensorBias: { current: -0.05 } },
  ],
  [
    'AGM 12 V 220 Ah (110 Ah usable), warm, weekly, run to 30–50 %',
    { chemistry: 'agm', nominalVoltage: 12, ratedCapacityAh: 220, usableCapacityAh: 110 },
    {
      pack: { chemistry: 'agm', nominalVoltage: 12, ratedCapacityAh: 220 },
      climate: WARM,
      usage: LEAD_ACID_USE,
    },
  ],
  [
    'flooded 48 V 400 Ah (200 Ah usable), warm, full every 4 days',
    { chemistry: 'flooded', nominalVoltage: 48, ratedCapacityAh: 400, usableCapacityAh: 200 },
    {
      pack: { chemistry: 'flooded', nominalVoltage: 48, ratedCapacityAh: 400 },
      climate: WARM,
      usage: { ...LEAD_ACID_USE, fullChargeEveryDays: 4, solarPeakCurrent: 25, shoreChargerCurrent: 60 },
    },
  ],
];

describe.each(ACCURACY_CASES)('capacity estimate against the truth: %s', (_name, setup, options) => {
  it(
    'keeps every sample within 3 σ of the truth and the present estimate within 3 %',
    () => {
      const tracker = createCapacityTracker(setup);
      const ownerShare = setup.usableCapacityAh / setup.ratedCapacityAh;
      const samples: CapacitySample[] = [];
      let truthNow = 0;
      for (const { minute, truth } of yearOfUse({ ...options, seed: 3, start: SPRING, days: 56 })) {
        truthNow = truth.capacityAh * ownerShare;
        const sample = tracker.push(minute);
        if (sample === undefined) continue;
        samples.push(sample);
        expect(Math.abs(sample.usableAh - truthNow)).toBeLessThan(3 * sample.sigmaAh);
      }
      expect(samples.length).toBeGreaterThanOrEqual(6);
      const { current } = capacityTrend(samples, setup.usableCapacityAh, 'UTC');
      expect(Math.abs((current?.usableAh ?? 0) / truthNow - 1)).toBeLessThan(0.03);
    },
    SLOW,
  );
});

function expectSameFigures(a: LifeCycleFigures, b: LifeCycleFigures): void {
  for (const key of ['ahIn', 'ahOut', 'whIn', 'whOut', 'equivalentFullCycles'] as const) {
    expect(a[key]).toBeCloseTo(b[key], 6);
  }
  expect(a.temperatureHours).toEqual(b.temperatureHours);
  expect(a.depthOfDischarge).toEqual(b.depthOfDischarge);
  expect(a.coldCharging.map((e) => [e.start, e.end])).toEqual(b.coldCharging.map((e) => [e.start, e.end]));
  a.coldCharging.forEach((e, i) => expect(e.ahIn).toBeCloseTo(b.coldCharging[i].ahIn, 9));
  expect(a.hotAtHighChargeHours).toBe(b.hotAtHighChargeHours);
  expect(a.chargeEfficiency).toBeCloseTo(b.chargeEfficiency ?? Number.NaN, 9);
}

/** One pass over the demo year feeding the tracker, the accumulator (also resumed mid-year) and a straight tally. */
function runDemoYear() {
  const result = {
    minutes: 0,
    samples: [] as CapacitySample[],
    truthAtSample: [] as number[],
    truthAtEnd: 0,
    capacityEverRose: false,
    dailyTruth: new Map<number, number>(),
    incremental: {} as LifeCycleFigures,
    straight: {} as LifeCycleFigures,
    resumedSamples: [] as CapacitySample[],
    resumedFigures: {} as LifeCycleFigures,
    resumedAt: 0,
    truthAround(at: number): number {
      return result.dailyTruth.get(Math.floor(at / DAY)) ?? Number.NaN;
    },
  };
  beforeAll(() => {
    const tracker = createCapacityTracker(DEMO_SETUP);
    const accumulator = createLifeCycleAccumulator(200);
    const tally = emptyTally();
    const halfway = DEMO_START + 182 * DAY;
    let resumed: ReturnType<typeof createCapacityTracker> | undefined;
    let resumedAccumulator: ReturnType<typeof createLifeCycleAccumulator> | undefined;
    let previous = Infinity;
    function* minutes(): Generator<MinuteSummary> {
      for (const { minute, truth } of yearOfUse({ seed: 2026, start: DEMO_START, days: 365 })) {
        result.minutes += 1;
        if (truth.capacityAh > previous) result.capacityEverRose = true;
        previous = truth.capacityAh;
        result.dailyTruth.set(Math.floor(minute.start / DAY), truth.capacityAh);
        if (minute.start === halfway) {
          resumed = createCapacityTracker(DEMO_SETUP, JSON.parse(JSON.stringify(tracker.state())));
          resumedAccumulator = createLifeCycleAccumulator(
            200,
            JSON.parse(JSON.stringify(accumulator.state())),
          );
          result.resumedAt = halfway;
        }
        const sample = tracker.push(minute);
        if (sample) {
          result.samples.push(sample);
          result.truthAtSample.push(truth.capacityAh);
        }
        const again = resumed?.push(minute);
        if (again) result.resumedSamples.push(again);
        result.truthAtEnd = truth.capacityAh;
        tallyMinute(tally, minute);
        yield minute;
      }
    }
    for (const hour of hoursOf(minutes())) {
      accumulator.push(hour);
      resumedAccumulator?.push(hour);
    }
    result.incremental = accumulator.figures();
    result.resumedFigures = resumedAccumulator?.figures() ?? ({} as LifeCycleFigures);
    result.straight = straightLifeCycleFigures(tally, 200);
  }, SLOW);
  return result;
}

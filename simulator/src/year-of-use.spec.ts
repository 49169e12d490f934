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

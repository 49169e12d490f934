import { AnalyticsSettingError } from '../analytics/analytics-error';
import { CURRENT_OFFSET_SIGMA_A } from './capacity-measurement';
import { capacityTrend, combineSamples, CURRENT_GAIN_SIGMA } from './capacity-trend';
import { CapacitySample } from './health-types';

const DAY = 86_400_000;
const HOUR = 3_600_000;

/** A sample ending at `at`, counted over `hours` from its sync. */
function sample(at: number, usableAh: number, sigmaAh: number, hours = 10): CapacitySample {
  return {
    at,
    fullAt: at - hours * HOUR,
    usableAh,
    sigmaAh,
    countedAh: usableAh * 0.85,
    socAtEnd: 0.15,
    method: 'rested-ocv',
    temperature: 20,
  };
}

describe('capacity trend', () => {
  it('combines samples by inverse-variance weighting, plus the errors they all share', () => {
    const samples = [sample(0, 100, 2), sample(DAY, 104, 4)];
    const combined = combineSamples(samples);
    // Inverse-variance weighted mean (Taylor, An Introduction to Error Analysis, 2nd ed., §7.2):
    // (100/4 + 104/16) / (1/4 + 1/16) = 100.8, σ = 1/√(5/16).
    expect(combined.usableAh).toBeCloseTo(100.8, 9);
    const statistical = 1 / Math.sqrt(1 / 4 + 1 / 16);
    const offsetShare =
      (((1 / 4) * (CURRENT_OFFSET_SIGMA_A * 10)) / 85 +
        ((1 / 16) * (CURRENT_OFFSET_SIGMA_A * 10)) / (104 * 0.85)) /
      (5 / 16);
    const shared = 100.8 * Math.hypot(offsetShare, CURRENT_GAIN_SIGMA);
    expect(combined.sigmaAh).toBeCloseTo(Math.hypot(statistical, shared), 9);
  });

  it('widens the uncertainty when samples scatter more than their own errors allow', () => {
    const tight = combineSamples([sample(0, 100, 1, 0.01), sample(DAY, 101, 1, 0.01)]);
    const scattered = combineSamples([sample(0, 95, 1, 0.01), sample(DAY, 105, 1, 0.01)]);
    // Scale factor √(χ²/(N−1)) (Particle Data Group, Review of Particle Physics, averaging — from memory): χ² = 50.
    const statistical = Math.sqrt(50) / Math.sqrt(2);
    expect(scattered.sigmaAh).toBeGreaterThan(tight.sigmaAh);
    expect(scattered.sigmaAh).toBeCloseTo(
      Math.hypot(statistical, 100 * Math.hypot((CURRENT_OFFSET_SIGMA_A * 0.01) / 85, CURRENT_GAIN_SIGMA)),
      6,
    );
  });

  it('groups samples by calendar month in the system time zone', () => {
    // 31 January 23:30 UTC is already 1 February in Oslo (UTC+1).
    const lateJanuaryUtc = Date.UTC(2026, 0, 31, 23, 30);
    const trend = capacityTrend(
      [sample(Date.UTC(2026, 0, 10), 200, 4), sample(lateJanuaryUtc, 190, 4)],
      200,
      'Europe/Oslo',
    );
    expect(trend.months.map((m) => [m.monthStart, m.usableAh, m.samples])).toEqual([
      [Date.UTC(2025, 11, 31, 23), 200, 1],
      [Date.UTC(2026, 0, 31, 23), 190, 1],
    ]);
  });

  it('keeps only the most certain sample after each full-charge sync, since they share one count', () => {
    const first = sample(Date.UTC(2026, 0, 10), 200, 4);
    const sameSync = { ...first, at: first.at + HOUR, usableAh: 150, sigmaAh: 8 };
    const trend = capacityTrend([first, sameSync], 200, 'UTC');
    expect(trend.months[0].samples).toBe(1);
    expect(trend.months[0].usableAh).toBe(200);
  });

  it('states the present capacity from the last 90 days, so fade shows', () => {
    const start = Date.UTC(2026, 0, 1);
    const samples = Array.from({ length: 52 }, (_, week) =>
      sample(start + week * 7 * DAY, 200 - week * 0.2, 4),
    );
    const { current } = capacityTrend(samples, 200, 'UTC');
    // The last 13 weekly samples (weeks 39–51) are within 90 days of the last: mean 200 − 45 × 0.2 = 191.
    expect(current?.usableAh).toBeCloseTo(191, 9);
    expect(current?.asOf).toBe(samples[51].at);
    expect(current?.stateOfHealth).toBeCloseTo(191 / 200, 9);
    expect(current?.sigmaStateOfHealth).toBeCloseTo((current?.sigmaAh ?? 0) / 200, 12);
  });

  it('says nothing about the present without samples, and skips malformed ones', () => {
    const broken = { ...sample(0, 100, 2), sigmaAh: Number.NaN };
    expect(capacityTrend([broken], 100, 'UTC')).toEqual({ months: [] });
  });

  it('names the field when the rated capacity or the zone is wrong', () => {
    expect(() => capacityTrend([], 0, 'UTC')).toThrow(AnalyticsSettingError);
    expect(() => capacityTrend([sample(0, 100, 2)], 100, 'Nowhere/Land')).toThrow(/timeZone/);
  });
});

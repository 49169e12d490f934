import { CapacityTrend, LifeCycleFigures } from './health-types';
import { healthWords } from './health-words';

const MONTH = 30.44 * 86_400_000;

const trend: CapacityTrend = {
  months: [
    { monthStart: 0, usableAh: 204.4, sigmaAh: 5, samples: 4 },
    { monthStart: 11 * MONTH, usableAh: 196.2, sigmaAh: 5, samples: 4 },
  ],
  current: { usableAh: 186, sigmaAh: 6, stateOfHealth: 0.93, sigmaStateOfHealth: 0.03, asOf: 11 * MONTH },
};

const figures: LifeCycleFigures = {
  equivalentFullCycles: 142.4,
  ahIn: 29_000,
  ahOut: 28_480,
  whIn: 380_000,
  whOut: 360_000,
  chargeEfficiency: 0.947,
  depthOfDischarge: [],
  temperatureHours: [],
  hotAtHighChargeHours: 0,
  coldCharging: [
    { start: 0, end: 3_600_000, ahIn: 12.25, lowestTemperature: -6.2, highestTemperature: -1 },
    { start: 9e9, end: 9e9 + 7_200_000, ahIn: 20, lowestTemperature: -3, highestTemperature: 0 },
  ],
  hotCharging: [],
  hoursCovered: 8760,
};

describe('health words', () => {
  it('states the capacity as a share of the rating with its uncertainty', () => {
    const words = healthWords(trend, figures, 'en-GB');
    expect(words[0]).toBe('It holds about 93 % of its rated usable capacity, ± 3 % (186 Ah ± 6 Ah).');
    expect(words).toContain('Measured month by month, it went from about 204 Ah to 196 Ah over 11 months.');
  });

  it('sums up use, efficiency and the charging evidence', () => {
    const words = healthWords(trend, figures, 'en-GB');
    expect(words).toContain(
      'Over 365 days of data it delivered 28,480 Ah, about 142 equivalent full cycles.',
    );
    expect(words).toContain('Between full charges it gave back 95 % of the energy put into it.');
    expect(words).toContain('It was charged below 0 °C twice, 32.3 Ah in all, at -6 °C at worst.');
    expect(words).toContain('It was never charged above 45 °C in the data.');
    expect(words[words.length - 1]).toMatch(/maker's charging temperature limits.*never replaces/);
  });

  it("writes numbers the reader's way and temperatures in their unit", () => {
    const words = healthWords(trend, figures, 'de-DE', 'F');
    expect(words).toContain(
      'Over 365 days of data it delivered 28.480 Ah, about 142 equivalent full cycles.',
    );
    // °F = °C × 9/5 + 32 (NIST SP 811, appendix B.8 — from memory): 0 °C = 32 °F, −6.2 °C ≈ 21 °F.
    expect(words).toContain('It was charged below 32 °F twice, 32,3 Ah in all, at 21 °F at worst.');
  });

  it('says what it still needs when there is no estimate, and falls back to English numbers for a bad locale', () => {
    const words = healthWords(
      { months: [] },
      { ...figures, coldCharging: [], chargeEfficiency: undefined },
      'no such',
    );
    expect(words[0]).toMatch(/^No capacity estimate yet: it needs a full charge/);
    expect(words).toContain('It was never charged below 0 °C in the data.');
    expect(words.some((w) => w.includes('never replaces'))).toBe(false);
    expect(words).toContain(
      'Over 365 days of data it delivered 28,480 Ah, about 142 equivalent full cycles.',
    );
  });
});

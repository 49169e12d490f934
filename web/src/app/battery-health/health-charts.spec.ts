import type { LifeCycleFigures } from '@cellwarden/shared';
import {
  bandLabel,
  barChartSummary,
  capacityChart,
  depthChart,
  energyChart,
  temperatureChart,
} from './health-charts';

const figures: LifeCycleFigures = {
  equivalentFullCycles: 10,
  ahIn: 2000,
  ahOut: 1900,
  whIn: 26_000,
  whOut: 24_350,
  depthOfDischarge: [
    { fromPercent: 0, toPercent: 10, cycles: 4 },
    { fromPercent: 10, toPercent: 20, cycles: 1.5 },
  ],
  temperatureHours: [
    { band: 'below-0', hours: 12.4 },
    { band: '10-35', hours: 700 },
  ],
  hotAtHighChargeHours: 0,
  coldCharging: [],
  hotCharging: [],
  hoursCovered: 712,
};

describe('health charts', () => {
  it('draws the capacity band one standard deviation either side of each month', () => {
    const data = capacityChart(
      { months: [{ monthStart: Date.UTC(2026, 2, 1), usableAh: 180, sigmaAh: 4, samples: 3 }] },
      190,
      'en-GB',
      'UTC',
    );
    expect(data.labels).toEqual(['Mar 2026']);
    const [upper, lower, estimate, rated] = data.datasets;
    expect(upper.data).toEqual([184]);
    expect(lower.data).toEqual([176]);
    expect(estimate.data).toEqual([180]);
    expect(rated.data).toEqual([190]);
  });

  it('labels a month in the system’s zone, not the viewer’s', () => {
    // 1 March 00:00 in Helsinki is 28 February 22:00 UTC.
    const data = capacityChart(
      { months: [{ monthStart: Date.UTC(2026, 1, 28, 22), usableAh: 180, sigmaAh: 4, samples: 3 }] },
      190,
      'en-GB',
      'Europe/Helsinki',
    );
    expect(data.labels).toEqual(['Mar 2026']);
  });

  // °F = °C × 9/5 + 32 (NIST SP 811, 2008, temperature conversion; from memory).
  it('names the temperature bands in the chosen unit', () => {
    expect(bandLabel('below-0', 'C')).toBe('below 0 °C');
    expect(bandLabel('10-35', 'C')).toBe('10 to 35 °C');
    expect(bandLabel('below-0', 'F')).toBe('below 32 °F');
    expect(bandLabel('35-45', 'F')).toBe('95 to 113 °F');
  });

  it('counts hours, cycles and kWh for the bars and says them in words', () => {
    const temperature = temperatureChart(figures, 'C');
    expect(temperature.datasets[0].data).toEqual([12, 700]);
    expect(depthChart(figures).datasets[0].data).toEqual([4, 1.5]);
    const energy = energyChart(figures);
    expect(energy.datasets[0].data).toEqual([26, 24.4]);
    expect(barChartSummary(energy, 'kWh')).toBe('Charged in: 26 kWh; Used out: 24.4 kWh');
  });
});

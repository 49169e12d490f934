import { toHistorySeries } from './to-history-series';

const points = [
  { measuredAt: 2000, voltage: 13.1, current: -5, temperature: 20, stateOfCharge: 60 },
  { measuredAt: 1000, voltage: 13.3, current: 4, temperature: 10 },
];

describe('toHistorySeries', () => {
  it('plots each quantity in time order on its own axis', () => {
    const data = toHistorySeries(points, 'C');
    expect(data.datasets.map((d) => d.yAxisID)).toEqual(['voltage', 'current', 'soc', 'temperature']);
    expect(data.datasets[0].data).toEqual([
      { x: 1000, y: 13.3 },
      { x: 2000, y: 13.1 },
    ]);
  });

  it('leaves out points without a state of charge rather than plotting zero', () =>
    expect(toHistorySeries(points, 'C').datasets[2].data).toEqual([{ x: 2000, y: 60 }]));

  it('plots temperature in the chosen unit', () => {
    // NIST SP 811 (2008), B.9: 10 °C = 50 °F, 20 °C = 68 °F.
    expect(toHistorySeries(points, 'F').datasets[3].data.map((p) => p.y)).toEqual([50, 68]);
    expect(toHistorySeries(points, 'F').datasets[3].label).toBe('Temperature (°F)');
  });

  it('returns a new object each time so the chart redraws', () =>
    expect(toHistorySeries(points, 'C')).not.toBe(toHistorySeries(points, 'C')));
});

import { appendWithin, toChartSeries } from './to-chart-series';

describe('toChartSeries', () => {
  const points = [
    { measuredAt: 2000, voltage: 13.2, current: -4 },
    { measuredAt: 1000, voltage: 13.3, current: 5 },
  ];

  it('plots voltage and current against time in time order', () => {
    const data = toChartSeries(points);
    expect(data.datasets[0].data).toEqual([
      { x: 1000, y: 13.3 },
      { x: 2000, y: 13.2 },
    ]);
    expect(data.datasets[1].data).toEqual([
      { x: 1000, y: 5 },
      { x: 2000, y: -4 },
    ]);
  });

  it('puts voltage and current on their own axes', () => {
    const data = toChartSeries(points);
    expect(data.datasets.map((d) => d.yAxisID)).toEqual(['voltage', 'current']);
  });

  it('returns a new object each time so the chart redraws', () => {
    expect(toChartSeries(points)).not.toBe(toChartSeries(points));
  });
});

describe('appendWithin', () => {
  it('drops points older than the window', () => {
    const kept = appendWithin([{ measuredAt: 0 }, { measuredAt: 500 }], { measuredAt: 1200 }, 1000);
    expect(kept.map((p) => p.measuredAt)).toEqual([500, 1200]);
  });
});

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

  it('keeps at most the newest maxPoints points', () => {
    const kept = appendWithin(
      [{ measuredAt: 1 }, { measuredAt: 2 }, { measuredAt: 3 }],
      { measuredAt: 4 },
      1000,
      2,
    );
    expect(kept.map((p) => p.measuredAt)).toEqual([3, 4]);
  });

  it('leaves the input array untouched so the chart sees a new object', () => {
    const points = [{ measuredAt: 1 }];
    const kept = appendWithin(points, { measuredAt: 2 }, 1000);
    expect(points).toHaveLength(1);
    expect(kept).not.toBe(points);
  });
});

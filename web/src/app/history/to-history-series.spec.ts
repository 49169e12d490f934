import { FALLBACK_PALETTE } from '../core/chart-palette';
import { GAP_INTERVALS, gapThreshold, toHistorySeries } from './to-history-series';

const points = [
  { measuredAt: 2000, voltage: 13.1, current: -5, temperature: 20, stateOfCharge: 60 },
  { measuredAt: 1000, voltage: 13.3, current: 4, temperature: 10 },
];

const MINUTE = 60_000;
const everyMinute = (from: number, count: number) =>
  Array.from({ length: count }, (_, i) => ({
    measuredAt: from + i * MINUTE,
    voltage: 13,
    current: 1,
    temperature: 5,
  }));

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

  it('shows every series, temperature included, unless it is hidden', () => {
    expect(toHistorySeries(points, 'C').datasets.map((d) => d.hidden)).toEqual([false, false, false, false]);
    expect(
      toHistorySeries(points, 'C', new Set(['temperature', 'soc'])).datasets.map((d) => d.hidden),
    ).toEqual([false, false, true, true]);
  });

  it('breaks the line across a gap of more than a few reporting intervals', () => {
    const data = toHistorySeries([...everyMinute(0, 30), ...everyMinute(120 * MINUTE, 30)], 'C');
    expect(data.datasets.every((d) => d.spanGaps === GAP_INTERVALS * MINUTE)).toBe(true);
  });

  it('returns a new object each time so the chart redraws', () =>
    expect(toHistorySeries(points, 'C')).not.toBe(toHistorySeries(points, 'C')));
});

describe('gapThreshold', () => {
  it('is a few times the usual spacing, whatever the gaps', () => {
    const spaced = [...everyMinute(0, 20), ...everyMinute(600 * MINUTE, 20)];
    expect(gapThreshold(spaced)).toBe(GAP_INTERVALS * MINUTE);
  });

  it('follows the data: hourly points allow a few hours', () =>
    expect(gapThreshold([0, 1, 2, 3].map((h) => ({ measuredAt: h * 3_600_000 })))).toBe(
      GAP_INTERVALS * 3_600_000,
    ));

  it('cannot tell from a single point', () => expect(gapThreshold([{ measuredAt: 5 }])).toBeNull());

  it('draws each series in the palette it is given, so lines follow the light or dark theme', () => {
    const palette = { ...FALLBACK_PALETTE, voltage: 'rgb(1, 2, 3)', temperature: 'rgb(4, 5, 6)' };
    const data = toHistorySeries(points, 'C', new Set(), palette);
    expect(data.datasets.map((d) => d.borderColor)).toEqual([
      'rgb(1, 2, 3)',
      FALLBACK_PALETTE.current,
      FALLBACK_PALETTE.soc,
      'rgb(4, 5, 6)',
    ]);
  });
});

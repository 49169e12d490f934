import type { AlertEvent } from '@cellwarden/shared';
import type { Chart } from 'chart.js';
import type { AnnotationOptions } from 'chartjs-plugin-annotation';
import { FALLBACK_PALETTE } from '../core/chart-palette';
import type { TimeRange } from '../core/time-range';
import {
  MIN_DRAG_PX,
  MIN_SPAN_PX,
  bandTimes,
  historyChartOptions,
  zoomedRange,
} from './history-chart-options';

const range: TimeRange = { from: 0, to: 1000 };

function alertEvent(id: string, severity: AlertEvent['severity'], startedAt: number, endedAt: number | null) {
  return {
    id,
    systemId: 'van-1',
    kind: 'cold-charging',
    severity,
    startedAt,
    endedAt,
    peakValue: -3,
    unit: 'Cel',
    acknowledgedAt: null,
    acknowledgedBy: null,
    note: null,
  } satisfies AlertEvent;
}

// A chart whose time axis shows 0–1000 ms across 500 px (2 ms per px), as the scriptable options see it.
const chart = { scales: { x: { left: 100, right: 600, min: 0, max: 1000 } } } as unknown as Chart;

describe('bandTimes', () => {
  it('covers a finished alert from start to end', () =>
    expect(bandTimes({ startedAt: 200, endedAt: 400 }, range, 0)).toEqual({ from: 200, to: 400 }));

  it('runs an active alert to the end of the range', () =>
    expect(bandTimes({ startedAt: 800, endedAt: null }, range, 0)).toEqual({ from: 800, to: 1000 }));

  it('clips an alert that began before the range', () =>
    expect(bandTimes({ startedAt: -500, endedAt: 100 }, range, 0)).toEqual({ from: 0, to: 100 }));

  it('skips an alert wholly outside the range', () =>
    expect(bandTimes({ startedAt: 1200, endedAt: 1400 }, range, 0)).toBeNull());

  it('widens a momentary alert so it stays visible, inside the range', () => {
    expect(bandTimes({ startedAt: 300, endedAt: 300 }, range, 6)).toEqual({ from: 300, to: 306 });
    expect(bandTimes({ startedAt: 1000, endedAt: 1000 }, range, 6)).toEqual({ from: 994, to: 1000 });
  });
});

describe('zoomedRange', () => {
  it('reads the dragged range off the axis in whole milliseconds', () =>
    expect(zoomedRange({ min: 200.4, max: 499.6 })).toEqual({ from: 200, to: 500 }));
});

describe('historyChartOptions', () => {
  const alerts = [
    alertEvent('w', 'warning', 200, 400),
    alertEvent('c', 'critical', 700, null),
    alertEvent('late', 'warning', 1200, 1400),
  ];
  const onSelect = jest.fn<void, [TimeRange]>();
  const options = historyChartOptions(range, alerts, 'C', 'en-GB', onSelect, FALLBACK_PALETTE);
  const bands = options.plugins!.annotation!.annotations as Record<string, AnnotationOptions<'box'>>;
  const edge = (band: AnnotationOptions<'box'>, key: 'xMin' | 'xMax') =>
    (band[key] as (context: { chart: Chart }) => number)({ chart });

  it('fixes the time axis to the chosen range', () => {
    expect(options.scales!['x']!.min).toBe(0);
    expect(options.scales!['x']!.max).toBe(1000);
  });

  it('shades each alert of the range behind the lines in its severity’s band colour', () => {
    expect(Object.keys(bands)).toEqual(['alert-w', 'alert-c']);
    expect(bands['alert-w']).toMatchObject({
      type: 'box',
      drawTime: 'beforeDatasetsDraw',
      backgroundColor: FALLBACK_PALETTE.warningBand,
      borderWidth: 0,
      adjustScaleRange: false,
    });
    expect(bands['alert-c'].backgroundColor).toBe(FALLBACK_PALETTE.criticalBand);
    expect([edge(bands['alert-w'], 'xMin'), edge(bands['alert-w'], 'xMax')]).toEqual([200, 400]);
    expect([edge(bands['alert-c'], 'xMin'), edge(bands['alert-c'], 'xMax')]).toEqual([700, 1000]);
  });

  it('draws a momentary alert at least the minimum width on the laid-out axis', () => {
    const momentary = historyChartOptions(
      range,
      [alertEvent('m', 'warning', 300, 300)],
      'C',
      'en-GB',
      onSelect,
    );
    const band = (momentary.plugins!.annotation!.annotations as Record<string, AnnotationOptions<'box'>>)[
      'alert-m'
    ];
    // 2 ms per px on the fake chart.
    expect(edge(band, 'xMax') - edge(band, 'xMin')).toBe(MIN_SPAN_PX * 2);
  });

  it('zooms by dragging across the time axis only, in the selection colour, ignoring a click', () => {
    const zoom = options.plugins!.zoom!;
    expect(zoom.zoom!.mode).toBe('x');
    expect(zoom.zoom!.drag).toMatchObject({
      enabled: true,
      threshold: MIN_DRAG_PX,
      backgroundColor: FALLBACK_PALETTE.selectionBand,
    });
    expect(zoom.zoom!.wheel?.enabled).toBeFalsy();
    expect(zoom.zoom!.pinch?.enabled).toBeFalsy();
    expect(zoom.pan!.enabled).toBe(false);
  });

  it('hands the dragged range to the page, which asks the server for it', () => {
    const zoomed = { scales: { x: { min: 250.2, max: 600.7 } } } as unknown as Chart;
    options.plugins!.zoom!.zoom!.onZoomComplete!({ chart: zoomed });
    expect(onSelect).toHaveBeenCalledWith({ from: 250, to: 601 });
  });
});

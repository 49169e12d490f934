import type { AlertEvent } from '@cellwarden/shared';
import type { Chart, ChartOptions } from 'chart.js';
import type { AnnotationOptions } from 'chartjs-plugin-annotation';
import { ChartPalette, FALLBACK_PALETTE } from '../core/chart-palette';
import { formatInstant } from '../core/date-time';
import type { TemperatureUnit } from '../core/temperature-unit';
import { timeTickLabel } from './time-axis';
import type { TimeRange } from '../core/time-range';

/** Narrowest alert band drawn, px, so a brief alert is still visible. */
export const MIN_SPAN_PX = 3;
/** A drag shorter than this, px, is a click, not a selection. */
export const MIN_DRAG_PX = 8;

/** An alert as a band needs it; `endedAt` is null while it is still active. */
export interface AlertSpan {
  startedAt: number;
  endedAt: number | null;
}

/**
 * The times an alert's band covers: clipped to the range (an active alert runs to its end), at least `minSpan`
 * ms wide and kept inside the range; null when the alert lies wholly outside it.
 */
export function bandTimes(span: AlertSpan, range: TimeRange, minSpan: number): TimeRange | null {
  const end = span.endedAt ?? range.to;
  if (end < range.from || span.startedAt > range.to) return null;
  const from = Math.max(range.from, span.startedAt);
  const width = Math.max(minSpan, Math.min(range.to, end) - from);
  const start = Math.max(range.from, Math.min(from, range.to - width));
  return { from: start, to: start + width };
}

/** The range the x axis shows after a drag-zoom, in whole milliseconds. */
export function zoomedRange(axis: { min: number; max: number }): TimeRange {
  return { from: Math.round(axis.min), to: Math.round(axis.max) };
}

/** How many ms `px` pixels span on the chart's time axis (0 before the axis is laid out). */
function pixelsToMs(chart: Chart, px: number): number {
  const x = chart.scales['x'];
  const width = x ? x.right - x.left : 0;
  return x && width > 0 ? ((x.max - x.min) * px) / width : 0;
}

/**
 * Chart options for a history range: fixed time axis labelled in the viewer's locale, one y axis per quantity
 * (shown while its series is), alert bands (chartjs-plugin-annotation), drag to zoom (chartjs-plugin-zoom). The
 * legend is the page's own series switches.
 */
export function historyChartOptions(
  range: TimeRange,
  alerts: readonly AlertEvent[],
  unit: TemperatureUnit,
  locale: string,
  onSelect: (range: TimeRange) => void,
  palette: ChartPalette = FALLBACK_PALETTE,
): ChartOptions<'line'> {
  const span = range.to - range.from;
  const side = { type: 'linear' as const, display: 'auto' as const, grid: { drawOnChartArea: false } };
  return {
    animation: false,
    maintainAspectRatio: false,
    parsing: false,
    normalized: true,
    interaction: { mode: 'nearest', axis: 'x', intersect: false },
    plugins: {
      // chart.js's canvas legend cannot be reached by keyboard; the series switches above the chart replace it.
      legend: { display: false },
      tooltip: {
        callbacks: { title: (items) => formatInstant(items[0]?.parsed.x ?? null, 'dateTime', locale) },
      },
      annotation: { annotations: alertBands(alerts, range, palette) },
      zoom: {
        pan: { enabled: false },
        zoom: {
          mode: 'x',
          // Mouse only; keyboard users have the custom-range form, touch users the presets.
          drag: {
            enabled: true,
            threshold: MIN_DRAG_PX,
            backgroundColor: palette.selectionBand,
            borderWidth: 0,
          },
          // The plugin has only rescaled the points already drawn: the page asks the server for the chosen
          // range (finer buckets), puts it in the address and redraws the chart from that answer.
          onZoomComplete: ({ chart }) => onSelect(zoomedRange(chart.scales['x'])),
        },
      },
    },
    scales: {
      x: {
        type: 'time',
        min: range.from,
        max: range.to,
        ticks: {
          maxRotation: 0,
          callback: (value, index, ticks) =>
            timeTickLabel(Number(value), index > 0 ? ticks[index - 1].value : null, span, locale),
        },
      },
      voltage: {
        type: 'linear',
        display: 'auto',
        position: 'left',
        title: { display: true, text: 'V' },
      },
      current: { ...side, position: 'right', title: { display: true, text: 'A' } },
      soc: { ...side, position: 'right', min: 0, max: 100, title: { display: true, text: '%' } },
      temperature: { ...side, position: 'left', title: { display: true, text: `°${unit}` } },
    },
  };
}

/** One box per alert behind the lines, translucent in its severity's colour so the lines stay readable. */
function alertBands(
  alerts: readonly AlertEvent[],
  range: TimeRange,
  palette: ChartPalette,
): Record<string, AnnotationOptions<'box'>> {
  const bands: Record<string, AnnotationOptions<'box'>> = {};
  for (const alert of alerts) {
    if (!bandTimes(alert, range, 0)) continue;
    const times = (chart: Chart) => bandTimes(alert, range, pixelsToMs(chart, MIN_SPAN_PX)) ?? range;
    bands[`alert-${alert.id}`] = {
      type: 'box',
      drawTime: 'beforeDatasetsDraw',
      // The x axis is the chosen range; a band never stretches it.
      adjustScaleRange: false,
      xMin: ({ chart }) => times(chart).from,
      xMax: ({ chart }) => times(chart).to,
      backgroundColor: alert.severity === 'critical' ? palette.criticalBand : palette.warningBand,
      borderWidth: 0,
    };
  }
  return bands;
}

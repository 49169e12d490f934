import type { AlertEvent } from '@cellwarden/shared';
import type { ChartOptions } from 'chart.js';
import { ChartPalette, FALLBACK_PALETTE } from '../core/chart-palette';
import { formatInstant } from '../core/date-time';
import type { TemperatureUnit } from '../core/temperature-unit';
import { timeTickLabel } from './time-axis';
import type { TimeRange } from '../core/time-range';

/**
 * Chart options for a history range: fixed time axis labelled in the viewer's locale, one y axis per quantity
 * (shown while its series is), alert bands, drag to zoom. The legend is the page's own series switches.
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
    // mousedown/mouseup are not in chart.js's default list; the drag-zoom plugin needs them.
    events: ['mousedown', 'mouseup', 'mousemove', 'mouseout', 'touchstart', 'touchmove', 'click'],
    interaction: { mode: 'nearest', axis: 'x', intersect: false },
    plugins: {
      // chart.js's canvas legend toggles on both mouseup and click (both are listened to, for the drag) and
      // cannot be reached by keyboard; the series switches above the chart replace it.
      legend: { display: false },
      tooltip: {
        callbacks: { title: (items) => formatInstant(items[0]?.parsed.x ?? null, 'dateTime', locale) },
      },
      cwAlertSpans: {
        spans: alerts.map((a) => ({ startedAt: a.startedAt, endedAt: a.endedAt, severity: a.severity })),
        rangeEnd: range.to,
        // Translucent, from the status colours, so the lines stay readable over an alert's span.
        colors: { warning: palette.warningBand, critical: palette.criticalBand },
      },
      cwDragZoom: { onSelect, color: palette.selectionBand },
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

import type { AlertEvent } from '@cellwarden/shared';
import type { ChartOptions } from 'chart.js';
import type { TemperatureUnit } from '../core/temperature-unit';
import type { TimeRange } from './time-range';

/** Band colours for alert spans: translucent so the lines stay readable. */
export const SPAN_COLORS = { warning: 'rgba(224, 138, 30, 0.18)', critical: 'rgba(206, 52, 52, 0.22)' };

/** Chart options for a history range: fixed time axis, one y axis per quantity, alert bands, drag to zoom. */
export function historyChartOptions(
  range: TimeRange,
  alerts: readonly AlertEvent[],
  unit: TemperatureUnit,
  onSelect: (range: TimeRange) => void,
): ChartOptions<'line'> {
  return {
    animation: false,
    maintainAspectRatio: false,
    parsing: false,
    normalized: true,
    // mousedown/mouseup are not in chart.js's default list; the drag-zoom plugin needs them.
    events: ['mousedown', 'mouseup', 'mousemove', 'mouseout', 'touchstart', 'touchmove', 'click'],
    interaction: { mode: 'nearest', axis: 'x', intersect: false },
    plugins: {
      decimation: { enabled: true, algorithm: 'lttb', samples: 800 },
      cwAlertSpans: {
        spans: alerts.map((a) => ({ startedAt: a.startedAt, endedAt: a.endedAt, severity: a.severity })),
        rangeEnd: range.to,
        colors: SPAN_COLORS,
      },
      cwDragZoom: { onSelect, color: 'rgba(91, 110, 225, 0.2)' },
    },
    scales: {
      x: { type: 'time', min: range.from, max: range.to },
      voltage: { type: 'linear', position: 'left', title: { display: true, text: 'V' } },
      current: {
        type: 'linear',
        position: 'right',
        title: { display: true, text: 'A' },
        grid: { drawOnChartArea: false },
      },
      soc: {
        type: 'linear',
        position: 'right',
        min: 0,
        max: 100,
        title: { display: true, text: '%' },
        grid: { drawOnChartArea: false },
      },
      temperature: {
        type: 'linear',
        position: 'left',
        display: 'auto',
        title: { display: true, text: `°${unit}` },
        grid: { drawOnChartArea: false },
      },
    },
  };
}

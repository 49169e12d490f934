import type { Chart, ChartType, Plugin } from 'chart.js';
import type { FlagSeverity } from '@cellwarden/shared';

/** One alert drawn on the time axis. */
export interface AlertSpan {
  startedAt: number;
  /** Null while still active: the span runs to the end of the range. */
  endedAt: number | null;
  severity: FlagSeverity;
}

/** Options of the alert-span plugin (`options.plugins.cwAlertSpans`). */
export interface AlertSpansOptions {
  spans: readonly AlertSpan[];
  /** Where an unfinished span stops, ms (usually the end of the range). */
  rangeEnd: number;
  colors: Record<FlagSeverity, string>;
}

declare module 'chart.js' {
  // Module augmentation must repeat chart.js's own type parameter, used or not.
  // eslint-disable-next-line @typescript-eslint/no-unused-vars
  interface PluginOptionsByType<TType extends ChartType> {
    cwAlertSpans?: AlertSpansOptions;
  }
}

/** The horizontal axis as the span maths needs it. */
export interface TimeAxis {
  left: number;
  right: number;
  pixelFor(value: number): number;
}

/** Narrowest band drawn, px, so a brief alert is still visible. */
export const MIN_SPAN_PX = 3;

/** The band a span covers in pixels, clipped to the axis; null when it lies wholly outside. */
export function spanPixels(
  span: AlertSpan,
  axis: TimeAxis,
  rangeEnd: number,
): { x: number; width: number } | null {
  const start = axis.pixelFor(span.startedAt);
  const end = axis.pixelFor(span.endedAt ?? rangeEnd);
  if (end < axis.left || start > axis.right) return null;
  const x0 = Math.max(axis.left, start);
  const x1 = Math.min(axis.right, end);
  const width = Math.max(MIN_SPAN_PX, x1 - x0);
  // Keep a minimum-width band inside the plot area.
  return { x: Math.min(x0, axis.right - width), width };
}

/** Shades each alert's time span behind the lines, critical ones in their own colour. */
export const alertSpansPlugin: Plugin<'line'> = {
  id: 'cwAlertSpans',
  beforeDatasetsDraw(chart: Chart<'line'>) {
    const options = chart.options.plugins?.cwAlertSpans as AlertSpansOptions | undefined;
    const scale = chart.scales['x'];
    if (!options || !scale) return;
    const axis: TimeAxis = {
      left: scale.left,
      right: scale.right,
      pixelFor: (v) => scale.getPixelForValue(v),
    };
    const { top, bottom } = chart.chartArea;
    const context = chart.ctx;
    context.save();
    for (const span of options.spans) {
      const band = spanPixels(span, axis, options.rangeEnd);
      if (!band) continue;
      context.fillStyle = options.colors[span.severity];
      context.fillRect(band.x, top, band.width, bottom - top);
    }
    context.restore();
  },
};

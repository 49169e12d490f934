import type { Chart, ChartType, Plugin } from 'chart.js';
import type { TimeRange } from '../core/time-range';

/** Options of the drag-to-zoom plugin (`options.plugins.cwDragZoom`). */
export interface DragZoomOptions {
  /** Called with the time range the person dragged across. */
  onSelect: (range: TimeRange) => void;
  color: string;
}

declare module 'chart.js' {
  // Module augmentation must repeat chart.js's own type parameter, used or not.
  // eslint-disable-next-line @typescript-eslint/no-unused-vars
  interface PluginOptionsByType<TType extends ChartType> {
    cwDragZoom?: DragZoomOptions;
  }
}

/** A drag shorter than this, px, is a click, not a selection. */
export const MIN_DRAG_PX = 8;

/** The time range between two pixel positions on the axis, clamped to the plot; null for a short drag. */
export function selectionRange(
  startPx: number,
  endPx: number,
  axis: { left: number; right: number; valueFor(px: number): number },
): TimeRange | null {
  const clamp = (px: number) => Math.min(axis.right, Math.max(axis.left, px));
  const a = clamp(Math.min(startPx, endPx));
  const b = clamp(Math.max(startPx, endPx));
  if (b - a < MIN_DRAG_PX) return null;
  return { from: Math.round(axis.valueFor(a)), to: Math.round(axis.valueFor(b)) };
}

interface DragState {
  startX: number;
  currentX: number;
}

const drags = new WeakMap<Chart, DragState>();

/** Lets the person drag across the chart to choose a range to zoom into. */
export const dragZoomPlugin: Plugin<'line'> = {
  id: 'cwDragZoom',
  afterEvent(chart: Chart<'line'>, args) {
    const options = chart.options.plugins?.cwDragZoom as DragZoomOptions | undefined;
    const scale = chart.scales['x'];
    const event = args.event;
    if (!options || !scale || event.x == null) return;
    const drag = drags.get(chart);
    if (event.type === 'mousedown' && event.x >= scale.left && event.x <= scale.right) {
      drags.set(chart, { startX: event.x, currentX: event.x });
    } else if (event.type === 'mousemove' && drag) {
      drag.currentX = event.x;
      args.changed = true;
    } else if (event.type === 'mouseup' && drag) {
      drags.delete(chart);
      args.changed = true;
      const axis = {
        left: scale.left,
        right: scale.right,
        valueFor: (px: number) => scale.getValueForPixel(px) ?? 0,
      };
      const range = selectionRange(drag.startX, event.x, axis);
      if (range) options.onSelect(range);
    } else if (event.type === 'mouseout' && drag) {
      drags.delete(chart);
      args.changed = true;
    }
  },
  afterDatasetsDraw(chart: Chart<'line'>) {
    const drag = drags.get(chart);
    const options = chart.options.plugins?.cwDragZoom as DragZoomOptions | undefined;
    if (!drag || !options) return;
    const { top, bottom } = chart.chartArea;
    const context = chart.ctx;
    context.save();
    context.fillStyle = options.color;
    context.fillRect(
      Math.min(drag.startX, drag.currentX),
      top,
      Math.abs(drag.currentX - drag.startX),
      bottom - top,
    );
    context.restore();
  },
};

import { ChartPalette, FALLBACK_PALETTE } from '../core/chart-palette';
import type { ChartData } from 'chart.js';

/** The fields the live chart plots. */
export interface ChartPoint {
  measuredAt: number;
  voltage: number;
  current: number;
}

/** Turns readings into a new chart.js data object: voltage on the left axis, current on the right. */
export function toChartSeries(
  points: readonly ChartPoint[],
  palette: ChartPalette = FALLBACK_PALETTE,
): ChartData<'line', { x: number; y: number }[]> {
  const sorted = [...points].sort((a, b) => a.measuredAt - b.measuredAt);
  return {
    datasets: [
      {
        label: 'Voltage (V)',
        data: sorted.map((p) => ({ x: p.measuredAt, y: p.voltage })),
        yAxisID: 'voltage',
        borderColor: palette.voltage,
        backgroundColor: palette.voltage,
        pointRadius: 0,
        tension: 0.2,
      },
      {
        label: 'Current (A)',
        data: sorted.map((p) => ({ x: p.measuredAt, y: p.current })),
        yAxisID: 'current',
        borderColor: palette.current,
        backgroundColor: palette.current,
        pointRadius: 0,
        tension: 0.2,
      },
    ],
  };
}

/** Appends a point and keeps only those within `windowMs` of the newest, and at most `maxPoints`. */
export function appendWithin<T extends { measuredAt: number }>(
  points: readonly T[],
  point: T,
  windowMs: number,
  maxPoints = Infinity,
): T[] {
  const cutoff = point.measuredAt - windowMs;
  const kept = [...points.filter((p) => p.measuredAt >= cutoff && p.measuredAt !== point.measuredAt), point];
  return kept.length > maxPoints ? kept.slice(kept.length - maxPoints) : kept;
}

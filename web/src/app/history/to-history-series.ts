import type { HistoryPoint } from '@cellwarden/shared';
import type { ChartData } from 'chart.js';
import { ChartPalette, FALLBACK_PALETTE } from '../core/chart-palette';
import { TemperatureUnit, celsiusToFahrenheit } from '../core/temperature-unit';

type XY = { x: number; y: number };

/** The quantities the history chart plots, each on its own axis. */
export type HistorySeries = 'voltage' | 'current' | 'soc' | 'temperature';

/** Every series, in the order the chart and its legend list them. */
export const HISTORY_SERIES: readonly HistorySeries[] = ['voltage', 'current', 'soc', 'temperature'];

/** What each series is called in the legend (temperature in the chosen unit). */
export function seriesLabel(series: HistorySeries, unit: TemperatureUnit): string {
  switch (series) {
    case 'voltage':
      return 'Voltage (V)';
    case 'current':
      return 'Current (A)';
    case 'soc':
      return 'State of charge (%)';
    case 'temperature':
      return `Temperature (°${unit})`;
  }
}

/** How many reporting intervals may pass before the line breaks: a missed reading or two is not a gap. */
export const GAP_INTERVALS = 3;

/**
 * The longest stretch between two points still drawn as a line, ms: a few times the data's usual interval
 * (the median spacing, so the gaps themselves do not inflate it); null with too few points to tell.
 */
export function gapThreshold(points: readonly Pick<HistoryPoint, 'measuredAt'>[]): number | null {
  const times = points.map((p) => p.measuredAt).sort((a, b) => a - b);
  const steps = times
    .slice(1)
    .map((t, i) => t - times[i])
    .filter((d) => d > 0)
    .sort((a, b) => a - b);
  if (steps.length === 0) return null;
  const middle = Math.floor(steps.length / 2);
  const median = steps.length % 2 ? steps[middle] : (steps[middle - 1] + steps[middle]) / 2;
  return median * GAP_INTERVALS;
}

/**
 * A new chart.js data object for stored readings: voltage, current, state of charge and temperature, the
 * ones in `hidden` left out of view; a stretch longer than the gap threshold stays empty rather than bridged.
 */
export function toHistorySeries(
  points: readonly HistoryPoint[],
  unit: TemperatureUnit,
  hidden: ReadonlySet<HistorySeries> = new Set(),
  palette: ChartPalette = FALLBACK_PALETTE,
): ChartData<'line', XY[]> {
  const sorted = [...points].sort((a, b) => a.measuredAt - b.measuredAt);
  const threshold = gapThreshold(sorted);
  const toUnit = unit === 'F' ? celsiusToFahrenheit : (c: number) => c;
  const values: Record<HistorySeries, XY[]> = {
    voltage: sorted.map((p) => ({ x: p.measuredAt, y: p.voltage })),
    current: sorted.map((p) => ({ x: p.measuredAt, y: p.current })),
    soc: sorted.filter((p) => p.stateOfCharge != null).map((p) => ({ x: p.measuredAt, y: p.stateOfCharge! })),
    temperature: sorted.map((p) => ({ x: p.measuredAt, y: toUnit(p.temperature) })),
  };
  return {
    datasets: HISTORY_SERIES.map((series) => ({
      label: seriesLabel(series, unit),
      data: values[series],
      yAxisID: series,
      hidden: hidden.has(series),
      borderColor: palette[series],
      backgroundColor: palette[series],
      borderWidth: 1.5,
      pointRadius: 0,
      // chart.js breaks the line where neighbouring points are further apart than this (x axis units, ms).
      spanGaps: threshold ?? false,
    })),
  };
}

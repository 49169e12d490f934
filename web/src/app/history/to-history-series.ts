import type { HistoryPoint } from '@cellwarden/shared';
import type { ChartData } from 'chart.js';
import { TemperatureUnit, celsiusToFahrenheit } from '../core/temperature-unit';

type XY = { x: number; y: number };

/** Series colours, picked for contrast on both themes. */
export const SERIES_COLORS = {
  voltage: '#1f9e8a',
  current: '#e08a1e',
  soc: '#5b6ee1',
  temperature: '#b5487a',
};

/** A new chart.js data object for stored readings: voltage, current, state of charge, and temperature (hidden). */
export function toHistorySeries(
  points: readonly HistoryPoint[],
  unit: TemperatureUnit,
): ChartData<'line', XY[]> {
  const sorted = [...points].sort((a, b) => a.measuredAt - b.measuredAt);
  const line = (label: string, yAxisID: string, color: string, data: XY[], hidden = false) => ({
    label,
    data,
    yAxisID,
    hidden,
    borderColor: color,
    backgroundColor: color,
    borderWidth: 1.5,
    pointRadius: 0,
    // A gap in the readings shows as a gap, not a straight line across it.
    spanGaps: false,
  });
  const toUnit = unit === 'F' ? celsiusToFahrenheit : (c: number) => c;
  return {
    datasets: [
      line(
        'Voltage (V)',
        'voltage',
        SERIES_COLORS.voltage,
        sorted.map((p) => ({ x: p.measuredAt, y: p.voltage })),
      ),
      line(
        'Current (A)',
        'current',
        SERIES_COLORS.current,
        sorted.map((p) => ({ x: p.measuredAt, y: p.current })),
      ),
      line(
        'State of charge (%)',
        'soc',
        SERIES_COLORS.soc,
        sorted.filter((p) => p.stateOfCharge != null).map((p) => ({ x: p.measuredAt, y: p.stateOfCharge! })),
      ),
      line(
        `Temperature (°${unit})`,
        'temperature',
        SERIES_COLORS.temperature,
        sorted.map((p) => ({ x: p.measuredAt, y: toUnit(p.temperature) })),
        true,
      ),
    ],
  };
}

// Pure transforms from the battery-health answer to chart.js data: built fresh in a `computed` so ng2-charts
// redraws, and kept here so each can be checked without a browser.
import type { CapacityTrend, LifeCycleFigures, TemperatureBand } from '@cellwarden/shared';
import type { ChartData } from 'chart.js';
import type { TemperatureUnit } from '../core/temperature-unit';

/** Colours of the health charts, from Cellwarden's own palette (indigo, lichen, ochre, brick, copper). */
export const HEALTH_COLORS = {
  capacity: '#4a56b8',
  band: 'rgba(74, 86, 184, 0.22)',
  rated: '#8a8f9c',
  energyIn: '#4f8a5b',
  energyOut: '#b4662a',
  dod: '#4a56b8',
} as const;

/** Colour of each temperature band, cold to hot. */
export const BAND_COLORS: Record<TemperatureBand, string> = {
  'below-0': '#3b6aa8',
  '0-10': '#6ea2c9',
  '10-35': '#4f8a5b',
  '35-45': '#c68a2c',
  'above-45': '#a3402f',
};

const BAND_LIMITS_C: Record<TemperatureBand, [number | null, number | null]> = {
  'below-0': [null, 0],
  '0-10': [0, 10],
  '10-35': [10, 35],
  '35-45': [35, 45],
  'above-45': [45, null],
};

/** A band's name in the chosen unit: "below 32 °F", "50 to 95 °F". */
export function bandLabel(band: TemperatureBand, unit: TemperatureUnit): string {
  const show = (c: number) => `${Math.round(unit === 'F' ? (c * 9) / 5 + 32 : c)} °${unit}`;
  const [low, high] = BAND_LIMITS_C[band];
  if (low === null) return `below ${show(high!)}`;
  if (high === null) return `above ${show(low)}`;
  return `${show(low)} to ${show(high)}`.replace(` °${unit} to`, ' to');
}

/** Month label in the viewer's locale and the system's zone: "Mar 2026". */
export function monthLabel(monthStart: number, locale: string, timeZone: string): string {
  return new Intl.DateTimeFormat(locale, { month: 'short', year: 'numeric', timeZone }).format(monthStart);
}

/**
 * Capacity by month: the estimate as a line, its ±1σ band as a filled area between two hidden-edged lines,
 * and the rated usable capacity as a dashed reference.
 */
export function capacityChart(
  trend: CapacityTrend,
  ratedUsableAh: number,
  locale: string,
  timeZone: string,
): ChartData<'line'> {
  const months = trend.months;
  const round = (value: number) => Math.round(value * 10) / 10;
  return {
    labels: months.map((m) => monthLabel(m.monthStart, locale, timeZone)),
    datasets: [
      {
        label: 'Upper edge of the band',
        data: months.map((m) => round(m.usableAh + m.sigmaAh)),
        borderColor: 'transparent',
        backgroundColor: HEALTH_COLORS.band,
        pointRadius: 0,
        fill: '+1',
      },
      {
        label: 'Lower edge of the band',
        data: months.map((m) => round(m.usableAh - m.sigmaAh)),
        borderColor: 'transparent',
        pointRadius: 0,
        fill: false,
      },
      {
        label: 'Estimated usable capacity',
        data: months.map((m) => round(m.usableAh)),
        borderColor: HEALTH_COLORS.capacity,
        backgroundColor: HEALTH_COLORS.capacity,
        borderWidth: 2,
        pointRadius: 3,
      },
      {
        label: 'Rated usable capacity',
        data: months.map(() => ratedUsableAh),
        borderColor: HEALTH_COLORS.rated,
        borderDash: [6, 4],
        borderWidth: 1.5,
        pointRadius: 0,
      },
    ],
  };
}

/** Hours in each temperature band, one bar per band coloured cold to hot. */
export function temperatureChart(figures: LifeCycleFigures, unit: TemperatureUnit): ChartData<'bar'> {
  return {
    labels: figures.temperatureHours.map((t) => bandLabel(t.band, unit)),
    datasets: [
      {
        label: 'Hours',
        data: figures.temperatureHours.map((t) => Math.round(t.hours)),
        backgroundColor: figures.temperatureHours.map((t) => BAND_COLORS[t.band]),
      },
    ],
  };
}

/** Cycles by depth of discharge, one bar per 10 % band. */
export function depthChart(figures: LifeCycleFigures): ChartData<'bar'> {
  return {
    labels: figures.depthOfDischarge.map((d) => `${d.fromPercent}–${d.toPercent} %`),
    datasets: [
      {
        label: 'Cycles',
        data: figures.depthOfDischarge.map((d) => Math.round(d.cycles * 10) / 10),
        backgroundColor: HEALTH_COLORS.dod,
      },
    ],
  };
}

/** Energy in and out, kWh, side by side. */
export function energyChart(figures: LifeCycleFigures): ChartData<'bar'> {
  const kwh = (wh: number) => Math.round(wh / 100) / 10;
  return {
    labels: ['Charged in', 'Used out'],
    datasets: [
      {
        label: 'kWh',
        data: [kwh(figures.whIn), kwh(figures.whOut)],
        backgroundColor: [HEALTH_COLORS.energyIn, HEALTH_COLORS.energyOut],
      },
    ],
  };
}

/** One sentence that says what a bar chart shows, for people who do not see the canvas. */
export function barChartSummary(data: ChartData<'bar'>, unit: string): string {
  const values = data.datasets[0]?.data ?? [];
  return (data.labels ?? []).map((label, i) => `${String(label)}: ${String(values[i])} ${unit}`).join('; ');
}

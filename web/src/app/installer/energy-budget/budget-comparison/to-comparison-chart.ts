import type { ChartConfiguration } from 'chart.js';
import { ComparedDay, formatDay } from './budget-gap';

/** Bars of measured energy in and out per day with the plan as flat lines; a new object so ng2-charts redraws. */
export function toComparisonChart(days: readonly ComparedDay[], locale: string): ChartConfiguration['data'] {
  const round = (wh: number) => Math.round(wh);
  return {
    labels: days.map((d) => formatDay(d.day, locale)),
    datasets: [
      { type: 'bar', label: 'Measured out', data: days.map((d) => round(d.measuredOut)), borderRadius: 4 },
      { type: 'bar', label: 'Measured in', data: days.map((d) => round(d.measuredIn)), borderRadius: 4 },
      {
        type: 'line',
        label: 'Planned out',
        data: days.map((d) => round(d.plannedOut)),
        borderDash: [6, 4],
        pointRadius: 0,
      },
      {
        type: 'line',
        label: 'Planned in',
        data: days.map((d) => round(d.plannedIn)),
        borderDash: [2, 3],
        pointRadius: 0,
      },
    ],
  };
}

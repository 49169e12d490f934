import type { ChartConfiguration } from 'chart.js';

/** Bar chart data: energy stored (after charge losses) vs energy out per day, Wh. A new object each time so ng2-charts redraws. */
export function toBudgetChart(whInPerDay: number, whOutPerDay: number): ChartConfiguration<'bar'>['data'] {
  return {
    labels: ['Energy stored', 'Energy out'],
    datasets: [{ label: 'Wh per day', data: [round(whInPerDay), round(whOutPerDay)], borderRadius: 6 }],
  };
}

/** The chart's text alternative, e.g. "Energy stored 640 Wh a day, energy out 676 Wh a day: 36 Wh short." */
export function budgetChartSummary(whInPerDay: number, whOutPerDay: number): string {
  const balance = round(whInPerDay - whOutPerDay);
  const verdict = balance >= 0 ? `${balance} Wh to spare` : `${-balance} Wh short`;
  return `Energy stored ${round(whInPerDay)} Wh a day, energy out ${round(whOutPerDay)} Wh a day: ${verdict}.`;
}

function round(wh: number): number {
  return Math.round(wh);
}

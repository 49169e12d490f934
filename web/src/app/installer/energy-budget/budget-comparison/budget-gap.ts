// The comparison of a budget with the measured days, in words and per day, for the installer and the owner.
import type { EnergyBudgetComparison } from '@cellwarden/shared';

/** One measured day beside the plan, Wh. `day` is the UTC date (YYYY-MM-DD) the server grouped by. */
export interface ComparedDay {
  day: string;
  plannedIn: number;
  measuredIn: number;
  plannedOut: number;
  measuredOut: number;
  /** Measured − planned energy out, Wh: positive when more was used than planned. */
  outGap: number;
}

/** Gaps smaller than this share of the plan read as "about as planned". */
const CLOSE_SHARE = 0.05;

/** The measured days with the plan beside each. */
export function comparedDays(comparison: EnergyBudgetComparison): ComparedDay[] {
  const { whInPerDay, whOutPerDay } = comparison.budget;
  return comparison.measured.perDay.map((d) => ({
    day: d.day,
    plannedIn: whInPerDay,
    measuredIn: d.whIn,
    plannedOut: whOutPerDay,
    measuredOut: d.whOut,
    outGap: d.whOut - whOutPerDay,
  }));
}

/** A UTC day (YYYY-MM-DD) in the viewer's locale, e.g. "Tue, 1 Dec". */
export function formatDay(day: string, locale: string): string {
  return new Intl.DateTimeFormat(locale, {
    weekday: 'short',
    day: 'numeric',
    month: 'short',
    timeZone: 'UTC',
  }).format(new Date(`${day}T00:00:00Z`));
}

/**
 * The gap in plain words, e.g. "Used 380 Wh/day more than planned (1,060 against 680 Wh/day); the largest gap
 * is on Tue, 1 Dec (+620 Wh). Charged 120 Wh/day less than planned (…)."
 */
export function describeBudgetGap(comparison: EnergyBudgetComparison, locale: string): string {
  const days = comparedDays(comparison);
  if (days.length === 0) return `No readings in the last ${comparison.days} days to compare the budget with.`;
  const wh = (value: number) => new Intl.NumberFormat(locale, { maximumFractionDigits: 0 }).format(value);
  const { budget, comparison: c } = comparison;
  const sentence = (verb: string, gap: number, actual: number, planned: number) => {
    if (Math.abs(gap) <= CLOSE_SHARE * Math.max(planned, 1))
      return `${verb} about what was planned (${wh(actual)} against ${wh(planned)} Wh/day)`;
    return `${verb} ${wh(Math.abs(gap))} Wh/day ${gap > 0 ? 'more' : 'less'} than planned (${wh(actual)} against ${wh(planned)} Wh/day)`;
  };
  const used = sentence('Used', c.whOutDifferencePerDay, c.actualWhOutPerDay, budget.whOutPerDay);
  const largest = days.reduce((worst, d) => (Math.abs(d.outGap) > Math.abs(worst.outGap) ? d : worst));
  const signed = `${largest.outGap > 0 ? '+' : '−'}${wh(Math.abs(largest.outGap))} Wh`;
  const charged = sentence('Charged', c.whInDifferencePerDay, c.actualWhInPerDay, budget.whInPerDay);
  const missing = comparison.days - days.length;
  const coverage =
    missing > 0 ? ` ${missing} of the ${comparison.days} days had no readings and count as zero.` : '';
  return `${used}; the largest gap is on ${formatDay(largest.day, locale)} (${signed} used). ${charged}.${coverage}`;
}

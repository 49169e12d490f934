// The battery's health in plain sentences for the screen and the report: numbers in the reader's locale,
// the uncertainty always beside the estimate, and a caution where the evidence is about charging.
import { CapacityTrend, ChargeEpisode, LifeCycleFigures } from './health-types';
import { COLD_CHARGE_BELOW_C, HOT_CHARGE_ABOVE_C, HOT_STORAGE_FROM_C } from './life-cycle-accumulator';

/** Plain sentences about the capacity estimate and the life-cycle figures, numbers in `locale`, temperatures in `unit`. */
export function healthWords(
  trend: CapacityTrend,
  figures: LifeCycleFigures,
  locale: string,
  unit: 'C' | 'F' = 'C',
): string[] {
  const n = numberFormatter(locale);
  const t = (celsius: number) =>
    unit === 'F' ? `${n((celsius * 9) / 5 + 32, 0)} °F` : `${n(celsius, 0)} °C`;
  const words = [capacityWords(trend, n), ...fadeWords(trend, n), useWords(figures, n)];
  if (figures.chargeEfficiency !== undefined) {
    const percent = n(figures.chargeEfficiency * 100, 0);
    words.push(`Between full charges it gave back ${percent} % of the energy put into it.`);
  }
  words.push(
    episodeWords(figures.coldCharging, `below ${t(COLD_CHARGE_BELOW_C)}`, { n, t }, 'lowestTemperature'),
    episodeWords(figures.hotCharging, `above ${t(HOT_CHARGE_ABOVE_C)}`, { n, t }, 'highestTemperature'),
  );
  if (figures.hotAtHighChargeHours > 0) {
    const hours = n(figures.hotAtHighChargeHours, 0);
    const hot = t(HOT_STORAGE_FROM_C);
    words.push(`It spent ${hours} h nearly full while hot (${hot} or more), which ages cells faster.`);
  }
  if (figures.coldCharging.length > 0 || figures.hotCharging.length > 0) {
    words.push(
      "Follow the battery maker's charging temperature limits; Cellwarden monitors and never replaces the battery's own protection.",
    );
  }
  return words;
}

type Format = (value: number, decimals: number) => string;

function numberFormatter(locale: string): Format {
  let chosen = 'en';
  try {
    chosen = Intl.NumberFormat.supportedLocalesOf([locale]).length > 0 ? locale : 'en';
  } catch {
    // A malformed tag falls back to English numbers rather than failing the page.
  }
  return (value, decimals) =>
    new Intl.NumberFormat(chosen, {
      minimumFractionDigits: decimals,
      maximumFractionDigits: decimals,
    }).format(value);
}

function capacityWords(trend: CapacityTrend, n: Format): string {
  if (trend.current === undefined) {
    return (
      'No capacity estimate yet: it needs a full charge followed, without another full charge in between, ' +
      'by a deep discharge and a rest (or a cut-off by the battery protection).'
    );
  }
  const { stateOfHealth, sigmaStateOfHealth, usableAh, sigmaAh } = trend.current;
  return (
    `It holds about ${n(stateOfHealth * 100, 0)} % of its rated usable capacity, ± ${n(Math.max(sigmaStateOfHealth * 100, 1), 0)} % ` +
    `(${n(usableAh, 0)} Ah ± ${n(sigmaAh, 0)} Ah).`
  );
}

function fadeWords(trend: CapacityTrend, n: Format): string[] {
  const { months } = trend;
  if (months.length < 2) return [];
  const first = months[0];
  const last = months[months.length - 1];
  const spanMonths = Math.round((last.monthStart - first.monthStart) / (30.44 * 86_400_000));
  return [
    `Measured month by month, it went from about ${n(first.usableAh, 0)} Ah to ${n(last.usableAh, 0)} Ah ` +
      `over ${n(spanMonths, 0)} months.`,
  ];
}

function useWords(figures: LifeCycleFigures, n: Format): string {
  const days = n(figures.hoursCovered / 24, 0);
  return (
    `Over ${days} days of data it delivered ${n(figures.ahOut, 0)} Ah, about ` +
    `${n(figures.equivalentFullCycles, 0)} equivalent full cycles.`
  );
}

function episodeWords(
  episodes: readonly ChargeEpisode[],
  limit: string,
  { n, t }: { n: Format; t: (celsius: number) => string },
  extreme: 'lowestTemperature' | 'highestTemperature',
): string {
  if (episodes.length === 0) return `It was never charged ${limit} in the data.`;
  const ah = episodes.reduce((sum, e) => sum + e.ahIn, 0);
  const temperatures = episodes.map((e) => e[extreme]);
  const worst = extreme === 'lowestTemperature' ? Math.min(...temperatures) : Math.max(...temperatures);
  const times = ['once', 'twice'][episodes.length - 1] ?? `${n(episodes.length, 0)} times`;
  return `It was charged ${limit} ${times}, ${n(ah, 1)} Ah in all, at ${t(worst)} at worst.`;
}

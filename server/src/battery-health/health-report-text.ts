// Text pieces the PDF and the CSV of a health report share, so both say the same thing the same way.
import type { ChargeEpisode, TemperatureBand } from '@cellwarden/shared';
import { stripControlCharacters } from '../mail/control-characters';
import type { TemperatureUnitCode } from './health-report-input';

/** A temperature in the reader's unit: "−4.1 °C" or "24.6 °F" (the minus sign typeset). */
export function temperatureText(celsius: number, unit: TemperatureUnitCode, digits = 1): string {
  const value = unit === 'F' ? (celsius * 9) / 5 + 32 : celsius;
  return `${signed(value, digits)} °${unit}`;
}

/** The name of a temperature band in the reader's unit. */
export function bandName(band: TemperatureBand, unit: TemperatureUnitCode): string {
  const t = (celsius: number) => temperatureText(celsius, unit, 0);
  switch (band) {
    case 'below-0':
      return `below ${t(0)}`;
    case '0-10':
      return `${t(0)} to ${t(10)}`;
    case '10-35':
      return `${t(10)} to ${t(35)}`;
    case '35-45':
      return `${t(35)} to ${t(45)}`;
    case 'above-45':
      return `above ${t(45)}`;
  }
}

export const CHEMISTRY_NAMES: Record<string, string> = {
  lifepo4: 'LiFePO4',
  agm: 'AGM lead-acid',
  flooded: 'Flooded lead-acid',
};

/** "2026-03-14" in the system's time zone. */
export function localDay(at: number, timeZone: string): string {
  return new Intl.DateTimeFormat('en-CA', {
    timeZone,
    year: 'numeric',
    month: '2-digit',
    day: '2-digit',
  }).format(new Date(at));
}

/** "2026-03-14 06:00" in the system's time zone (the zone is named once, in the heading). */
export function localTime(at: number, timeZone: string): string {
  const parts = new Intl.DateTimeFormat('en-CA', {
    timeZone,
    year: 'numeric',
    month: '2-digit',
    day: '2-digit',
    hour: '2-digit',
    minute: '2-digit',
    hourCycle: 'h23',
  }).formatToParts(new Date(at));
  const part = (type: Intl.DateTimeFormatPartTypes) => parts.find((p) => p.type === type)?.value ?? '';
  return `${part('year')}-${part('month')}-${part('day')} ${part('hour')}:${part('minute')}`;
}

/** "2026-01-14 22:00 – 2026-01-15 04:00, 6.2 Ah in, pack −4.1 °C to −1.0 °C". */
export function episodeLine(
  episode: ChargeEpisode,
  timeZone: string,
  unit: TemperatureUnitCode = 'C',
): string {
  return (
    `${localTime(episode.start, timeZone)} – ${localTime(episode.end, timeZone)}, ` +
    `${episode.ahIn.toFixed(1)} Ah in, pack ${temperatureText(episode.lowestTemperature, unit)} to ` +
    temperatureText(episode.highestTemperature, unit)
  );
}

const signed = (value: number, digits = 1) => value.toFixed(digits).replace('-', '−');

/**
 * Text the PDF's built-in Helvetica can show (WinAnsiEncoding): locale spaces become plain spaces, the minus
 * sign a hyphen, anything else outside the encoding a question mark, and control characters go.
 */
export function winAnsiText(text: string): string {
  return stripControlCharacters(text)
    .replace(/[\u00a0\u202f\u2009]/g, ' ')
    .replace(/\u2212/g, '-')
    .replace(/[^\u0020-\u007e\u00a0-\u00ff\u2013\u2014\u2018\u2019\u201c\u201d\u2022\u2026\u20ac]/g, '?');
}

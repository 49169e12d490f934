// Text pieces the PDF and the CSV of a health report share, so both say the same thing the same way.
import type { ChargeEpisode, TemperatureBand } from '@cellwarden/shared';
import { stripControlCharacters } from '../mail/control-characters';

/** Names of the temperature bands, °C. */
export const BAND_NAMES: Record<TemperatureBand, string> = {
  'below-0': 'below 0 °C',
  '0-10': '0 to 10 °C',
  '10-35': '10 to 35 °C',
  '35-45': '35 to 45 °C',
  'above-45': 'above 45 °C',
};

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

/** "2026-01-14 22:00 – 2026-01-15 04:00, 6.2 Ah in, pack −4.1 to −1.0 °C". */
export function episodeLine(episode: ChargeEpisode, timeZone: string): string {
  return (
    `${localTime(episode.start, timeZone)} – ${localTime(episode.end, timeZone)}, ` +
    `${episode.ahIn.toFixed(1)} Ah in, pack ${signed(episode.lowestTemperature)} to ${signed(episode.highestTemperature)} °C`
  );
}

const signed = (value: number) => value.toFixed(1).replace('-', '−');

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

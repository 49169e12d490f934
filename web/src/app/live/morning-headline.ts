import type { DerivedState } from '@cellwarden/shared';
import { formatInstant, sameClock, zoneName } from '../core/date-time';

/** The answer to "will it last until morning?", in words and with its tone. */
export interface MorningHeadline {
  /** True when the charge holds until the morning mark. */
  lasts: boolean;
  text: string;
}

/** Where and for whom the headline is written. */
export interface HeadlineContext {
  now: number;
  locale: string;
  /** The system's IANA time zone (its clock sets "morning"). */
  systemZone: string;
  /** The viewer's IANA time zone. */
  viewerZone: string;
}

/**
 * "Lasts until 07:00 with 42 % to spare" or "Runs out around 03:40", from the server's projection to the
 * system's next 07:00 and its hours to empty; times on the system's clock, its zone named when the viewer's
 * clock differs. Null when there is no projection to speak of.
 */
export function morningHeadline(
  derived: DerivedState | null,
  context: HeadlineContext,
): MorningHeadline | null {
  const morning = derived?.byMorning;
  if (!morning) return null;
  const { now, locale, systemZone, viewerZone } = context;
  const time = (ms: number) => formatInstant(ms, 'time', locale, systemZone);
  const zone = sameClock(systemZone, viewerZone, morning.at)
    ? ''
    : ` (system time, ${zoneName(systemZone, locale, morning.at)})`;
  const hoursToEmpty = derived.hoursToEmpty;
  // "Around" a time: to the nearest minute, not the second the straight line happens to cross.
  const emptyAt =
    hoursToEmpty != null && Number.isFinite(hoursToEmpty)
      ? Math.round((now + hoursToEmpty * 3_600_000) / 60_000) * 60_000
      : null;
  if ((emptyAt !== null && emptyAt <= morning.at) || morning.stateOfCharge <= 0) {
    const at = emptyAt ?? morning.at;
    return { lasts: false, text: `Runs out around ${time(at)}${zone}, before ${time(morning.at)}` };
  }
  const spare = Math.round(morning.stateOfCharge);
  return { lasts: true, text: `Lasts until ${time(morning.at)}${zone} with ${spare} % to spare` };
}

/** Amp-hours left in the usable capacity at a state of charge (percent); null when either is unknown. */
export function ampHoursRemaining(
  stateOfCharge: number | null,
  usableCapacityAh: number | null,
): number | null {
  if (stateOfCharge == null || usableCapacityAh == null) return null;
  if (!Number.isFinite(stateOfCharge) || !Number.isFinite(usableCapacityAh)) return null;
  return (Math.min(100, Math.max(0, stateOfCharge)) / 100) * usableCapacityAh;
}

// The UTC offset comes from the shared zone clock (one formatter cache for the server and the domain code).
export { utcOffsetMinutes } from '@cellwarden/shared';

/** Whether the platform knows the zone name. */
export function isKnownTimeZone(timeZone: string): boolean {
  try {
    new Intl.DateTimeFormat('en-US', { timeZone });
    return true;
  } catch {
    return false;
  }
}

// A span of stored readings replayed through the same analytics as the live path, to find the flag episodes
// it held: what a device's late backlog would have raised had it arrived on time.
import type { FlagKind, FlagSeverity } from '../api/alerts-contract';
import type { BatteryReading } from '../telemetry/reading';
import {
  deriveSystemState,
  type SystemAnalyticsSettings,
  type SystemAnalyticsState,
} from './derive-system-state';

/** One flag from its start to its end within a replayed span. */
export interface FlagEpisode {
  kind: FlagKind;
  severity: FlagSeverity;
  startedAt: number;
  endedAt: number;
  peak: number;
  unit: string;
}

/** The episodes that both started and ended within `readings` (time order); one still open at the end is left out. */
export function flagEpisodes(
  readings: readonly BatteryReading[],
  settings: SystemAnalyticsSettings,
): FlagEpisode[] {
  const open = new Map<FlagKind, Omit<FlagEpisode, 'endedAt'>>();
  const episodes: FlagEpisode[] = [];
  let state: SystemAnalyticsState | undefined;
  for (const reading of readings) {
    const step = deriveSystemState(state, reading, settings);
    state = step.state;
    for (const event of step.events) {
      if (event.transition === 'start')
        open.set(event.kind, {
          kind: event.kind,
          severity: event.severity,
          startedAt: event.at,
          peak: event.peak,
          unit: event.unit,
        });
      const episode = open.get(event.kind);
      if (!episode) continue;
      if (event.transition === 'escalate')
        open.set(event.kind, { ...episode, severity: event.severity, peak: event.peak });
      if (event.transition === 'end') {
        episodes.push({ ...episode, severity: event.severity, peak: event.peak, endedAt: event.at });
        open.delete(event.kind);
      }
    }
  }
  return episodes;
}

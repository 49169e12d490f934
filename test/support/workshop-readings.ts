import type { BatteryReading } from '@cellwarden/shared';
import { SCENARIOS } from '../../simulator/src/scenario-catalog';
import { simulateReadings } from '../../simulator/src/simulate-readings';

// 18:00 UTC is 18:20 local mean time at the workshop's 5.1° E: 25 minutes into one of its engine's runs.
const ENGINE_RUNNING = Date.UTC(2026, 0, 10, 18);

/**
 * A workshop scenario's readings, one a second, played while its engine runs and re-timed to end now: a
 * commissioning check sees the charger working whatever the wall clock says.
 */
export function workshopReadings(
  scenario: 'charger-commissioning' | 'thin-cable',
  count = 110,
): BatteryReading[] {
  const { readings } = simulateReadings(SCENARIOS[scenario], {
    seed: 7,
    start: ENGINE_RUNNING,
    intervalSeconds: 1,
    count,
  });
  const shift = Date.now() - 10_000 - readings[readings.length - 1].measuredAt;
  return readings.map((r) => ({ ...r, measuredAt: r.measuredAt + shift }));
}

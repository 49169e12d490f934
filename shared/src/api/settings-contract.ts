// Shapes of system settings and notification preferences.
import type { FlagKind } from './alerts-contract';

/** A charge source fitted to a system. */
export interface ChargeSource {
  /** The id a device uses for this source's current in a reading (`source:<id>`). */
  id: string;
  kind: 'dc-dc' | 'solar' | 'shore' | 'alternator' | 'other';
  label: string;
  /** A for chargers; for solar the controller's rated output current. */
  ratedCurrentA: number;
}

/** Flag thresholds of one system; absent values take the chemistry's defaults. */
export interface FlagThresholdSettings {
  lowChargeWarningPercent: number;
  lowChargeCriticalPercent: number;
  lowVoltageV: number;
  overTemperatureC: number;
  silentAfterMinutes: number;
}

/** GET/PUT /api/systems/:id/settings (PUT: owner, configure grant, or installer of the system's company). */
export interface SystemSettings {
  name: string;
  kind: 'van' | 'cabin' | 'boat';
  timeZone: string;
  battery: {
    chemistry: 'lifepo4' | 'agm' | 'flooded';
    nominalVoltage: 12 | 24 | 48;
    ratedCapacityAh: number;
    usableCapacityAh: number;
  };
  bms: { continuousDischargeA: number; lowVoltageCutoffV: number | null };
  chargeSources: ChargeSource[];
  thresholds: FlagThresholdSettings;
  /** The chemistry defaults the form shows beside each threshold. */
  thresholdDefaults?: FlagThresholdSettings;
}

/** What a person is e-mailed about until they choose (the user_preferences column's default, too). */
export const DEFAULT_EMAIL_FLAGS: readonly FlagKind[] = ['low-charge', 'cold-charging', 'device-silent'];

/** GET/PUT /api/me/preferences. */
export interface UserPreferences {
  temperatureUnit: 'C' | 'F';
  /** Flag kinds the person wants e-mail about (a notice when a flag starts and one when it clears). */
  emailFlags: FlagKind[];
}

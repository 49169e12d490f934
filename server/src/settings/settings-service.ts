import {
  resolveSystemAnalyticsSettings,
  analyticsConfigFromSettings,
  thresholdSettingDefaults,
  AnalyticsSettingError,
  type PublicUser,
  type SystemSettings,
  type UserPreferences,
} from '@cellwarden/shared';
import type { AuditService } from '../audit/audit-service';
import { invalidInput } from '../errors/app-error';
import type { SystemsService } from '../systems/systems-service';
import type { SettingsRepository, StoredSettings } from './settings-repository';

/** Reading and changing a system's settings and a person's preferences, through the access policy. */
export function createSettingsService(deps: {
  repository: SettingsRepository;
  systems: SystemsService;
  audit: AuditService;
  /** Told after a change, so the live analytics pick up the new settings. */
  onChanged: (systemId: string) => void;
}) {
  const present = (stored: StoredSettings): SystemSettings => {
    const defaults = thresholdSettingDefaults(
      stored.battery.chemistry,
      stored.battery.nominalVoltage,
      stored.battery.ratedCapacityAh,
    );
    return { ...stored, thresholds: { ...defaults, ...stored.thresholds }, thresholdDefaults: defaults };
  };
  return {
    async get(user: PublicUser, systemId: string): Promise<SystemSettings> {
      const system = await deps.systems.getFor(user, systemId, 'view');
      return present((await deps.repository.find(system.id))!);
    },

    async update(user: PublicUser, systemId: string, settings: SystemSettings): Promise<SystemSettings> {
      const system = await deps.systems.getFor(user, systemId, 'configure');
      const defaults = thresholdSettingDefaults(
        settings.battery.chemistry,
        settings.battery.nominalVoltage,
        settings.battery.ratedCapacityAh,
      );
      // Only values that differ from the chemistry's defaults are stored, so a later change of chemistry
      // brings its own defaults instead of keeping the old chemistry's numbers.
      const thresholds = Object.fromEntries(
        Object.entries(settings.thresholds).filter(
          ([key, value]) => defaults[key as keyof typeof defaults] !== value,
        ),
      );
      try {
        resolveSystemAnalyticsSettings(
          analyticsConfigFromSettings({ ...settings, thresholds: { ...defaults, ...thresholds } }, 0),
        );
      } catch (error) {
        if (error instanceof AnalyticsSettingError)
          throw invalidInput(error.field ?? 'settings', error.message);
        throw error;
      }
      const stored: StoredSettings = { ...settings, thresholds };
      delete (stored as Partial<SystemSettings>).thresholdDefaults;
      await deps.repository.update(system.id, stored);
      await deps.audit.record(system.id, user, 'system.changed', 'settings');
      deps.onChanged(system.id);
      return present(stored);
    },

    preferences: (user: PublicUser) => deps.repository.preferences(user.id),

    async savePreferences(user: PublicUser, preferences: UserPreferences): Promise<UserPreferences> {
      await deps.repository.savePreferences(user.id, preferences);
      return deps.repository.preferences(user.id);
    },
  };
}

export type SettingsService = ReturnType<typeof createSettingsService>;

import { QueryTypes, type Sequelize } from 'sequelize';
import {
  DEFAULT_EMAIL_FLAGS,
  type ChargeSource,
  type FlagThresholdSettings,
  type SystemSettings,
  type UserPreferences,
} from '@cellwarden/shared';
import { initModels } from '../database/models';

/** A system's settings as stored; thresholds hold only what the owner overrode. */
export interface StoredSettings extends Omit<SystemSettings, 'thresholds' | 'thresholdDefaults'> {
  thresholds: Partial<FlagThresholdSettings>;
}

interface SettingsRow {
  name: string;
  kind: SystemSettings['kind'];
  timeZone: string;
  chemistry: SystemSettings['battery']['chemistry'];
  nominalVoltage: 12 | 24 | 48;
  ratedCapacityAh: number;
  usableCapacityAh: number;
  continuousDischargeA: number | null;
  lowVoltageCutoffV: number | null;
  chargeSources: ChargeSource[];
  thresholds: Partial<FlagThresholdSettings>;
}

// Systems made before a BMS rating was recorded get a conservative 1C (common practice for LiFePO4 packs).
const toSettings = (row: SettingsRow): StoredSettings => ({
  name: row.name,
  kind: row.kind,
  timeZone: row.timeZone,
  battery: {
    chemistry: row.chemistry,
    nominalVoltage: row.nominalVoltage,
    ratedCapacityAh: row.ratedCapacityAh,
    usableCapacityAh: row.usableCapacityAh,
  },
  bms: {
    continuousDischargeA: row.continuousDischargeA ?? row.ratedCapacityAh,
    lowVoltageCutoffV: row.lowVoltageCutoffV,
  },
  chargeSources: row.chargeSources,
  thresholds: row.thresholds,
});

/** Data access for system settings and personal preferences. */
export function createSettingsRepository(sequelize: Sequelize) {
  const { UserPreference } = initModels(sequelize);
  return {
    async find(systemId: string): Promise<StoredSettings | undefined> {
      const [row] = await sequelize.query<SettingsRow>(
        `SELECT name, kind, time_zone AS "timeZone", chemistry, nominal_voltage AS "nominalVoltage",
           rated_capacity_ah AS "ratedCapacityAh", usable_capacity_ah AS "usableCapacityAh",
           bms_continuous_discharge_a AS "continuousDischargeA", bms_low_voltage_cutoff_v AS "lowVoltageCutoffV",
           charge_sources AS "chargeSources", flag_thresholds AS thresholds
         FROM systems WHERE id = :systemId`,
        { replacements: { systemId }, type: QueryTypes.SELECT },
      );
      return row && toSettings(row);
    },

    async update(systemId: string, settings: StoredSettings): Promise<void> {
      await sequelize.query(
        `UPDATE systems SET name = :name, kind = :kind, time_zone = :timeZone, chemistry = :chemistry,
           nominal_voltage = :nominalVoltage, rated_capacity_ah = :ratedCapacityAh, usable_capacity_ah = :usableCapacityAh,
           bms_continuous_discharge_a = :continuousDischargeA, bms_low_voltage_cutoff_v = :lowVoltageCutoffV,
           charge_sources = :chargeSources::jsonb, flag_thresholds = :thresholds::jsonb, updated_at = now()
         WHERE id = :systemId`,
        {
          replacements: {
            systemId,
            name: settings.name,
            kind: settings.kind,
            timeZone: settings.timeZone,
            ...settings.battery,
            continuousDischargeA: settings.bms.continuousDischargeA,
            lowVoltageCutoffV: settings.bms.lowVoltageCutoffV,
            chargeSources: JSON.stringify(settings.chargeSources),
            thresholds: JSON.stringify(settings.thresholds),
          },
        },
      );
    },

    async preferences(userId: string): Promise<UserPreferences> {
      const row = await UserPreference.findOne({
        where: { userId },
        attributes: ['temperatureUnit', 'emailFlags'],
        raw: true,
      });
      return row ?? { temperatureUnit: 'C', emailFlags: [...DEFAULT_EMAIL_FLAGS] };
    },

    async savePreferences(userId: string, preferences: UserPreferences): Promise<void> {
      // An empty opt-in list is stored as such (an empty text[]).
      await UserPreference.upsert(
        { userId, temperatureUnit: preferences.temperatureUnit, emailFlags: preferences.emailFlags },
        { returning: false },
      );
    },
  };
}

export type SettingsRepository = ReturnType<typeof createSettingsRepository>;

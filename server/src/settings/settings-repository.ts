import type { Sequelize } from 'sequelize';
import {
  DEFAULT_EMAIL_FLAGS,
  type ChargeSource,
  type FlagThresholdSettings,
  type SystemSettings,
  type UserPreferences,
} from '@cellwarden/shared';
import { initModels } from '../database/models';
import { isUuid } from '../database/sql-values';

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

// The systems columns a system's settings are made of (the table belongs to systems; its model is System).
const SETTINGS_ATTRIBUTES = [
  'name',
  'kind',
  'timeZone',
  'chemistry',
  'nominalVoltage',
  'ratedCapacityAh',
  'usableCapacityAh',
  'bmsContinuousDischargeA',
  'bmsLowVoltageCutoffV',
  'chargeSources',
  'flagThresholds',
];

/** Data access for system settings and personal preferences. */
export function createSettingsRepository(sequelize: Sequelize) {
  const { UserPreference, System } = initModels(sequelize);
  const fromRow = (row: InstanceType<typeof System>): StoredSettings =>
    toSettings({
      ...row,
      continuousDischargeA: row.bmsContinuousDischargeA ?? null,
      lowVoltageCutoffV: row.bmsLowVoltageCutoffV ?? null,
      thresholds: row.flagThresholds,
    });
  return {
    async find(systemId: string): Promise<StoredSettings | undefined> {
      const row = await System.findByPk(systemId, { attributes: SETTINGS_ATTRIBUTES, raw: true });
      return row ? fromRow(row) : undefined;
    },

    /** Many systems' settings in one query, by system id; a system that no longer exists is absent. */
    async findMany(systemIds: readonly string[]): Promise<Map<string, StoredSettings>> {
      // An id that is no uuid names no system, and would fail the whole query.
      const ids = systemIds.filter(isUuid);
      if (ids.length === 0) return new Map();
      const rows = await System.findAll({
        where: { id: ids },
        attributes: ['id', ...SETTINGS_ATTRIBUTES],
        raw: true,
      });
      return new Map(rows.map((row) => [row.id, fromRow(row)]));
    },

    async update(systemId: string, settings: StoredSettings): Promise<void> {
      // updated_at is set to the database's now() by the model (its default), as before.
      await System.update(
        {
          name: settings.name,
          kind: settings.kind,
          timeZone: settings.timeZone,
          ...settings.battery,
          bmsContinuousDischargeA: settings.bms.continuousDischargeA,
          bmsLowVoltageCutoffV: settings.bms.lowVoltageCutoffV,
          chargeSources: settings.chargeSources,
          flagThresholds: settings.thresholds,
        },
        { where: { id: systemId } },
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

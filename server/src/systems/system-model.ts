// Sequelize model of a battery system (table from the migrations; never synced). The fleet list and a system's
// summary stay SQL in systems-repository.ts: they join the latest reading of the partitioned readings table.
import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import { databaseNow, generatedUuidKey } from '../database/columns';
import type { ChargeSource, FlagThresholdSettings, SystemSettings } from '@cellwarden/shared';
import type { Company, User } from '../accounts/account-models';

/** One battery system: its battery, its BMS's ratings, its charge sources and the owner's flag overrides. */
export class System extends Model<InferAttributes<System>, InferCreationAttributes<System>> {
  declare id: CreationOptional<string>;
  declare name: string;
  declare kind: SystemSettings['kind'];
  declare chemistry: SystemSettings['battery']['chemistry'];
  declare nominalVoltage: 12 | 24 | 48;
  declare ratedCapacityAh: number;
  declare usableCapacityAh: number;
  declare bmsContinuousDischargeA: CreationOptional<number | null>;
  declare bmsLowVoltageCutoffV: CreationOptional<number | null>;
  declare bmsPeakDischargeA: CreationOptional<number | null>;
  declare bmsColdChargeCutoff: CreationOptional<boolean | null>;
  declare ownerId: ForeignKey<string>;
  declare installerCompanyId: ForeignKey<string> | null;
  declare timeZone: CreationOptional<string>;
  declare chargeSources: CreationOptional<ChargeSource[]>;
  /** Only the thresholds the owner overrode. */
  declare flagThresholds: CreationOptional<Partial<FlagThresholdSettings>>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare owner?: NonAttribute<User>;
  declare installerCompany?: NonAttribute<Company | null>;
}

/** Binds a subclass of System to one Sequelize instance. */
export function defineSystemModels(sequelize: Sequelize) {
  const BoundSystem = class extends System {};
  BoundSystem.init(
    {
      id: generatedUuidKey(),
      name: { type: DataTypes.TEXT, allowNull: false },
      kind: { type: DataTypes.TEXT, allowNull: false },
      chemistry: { type: DataTypes.TEXT, allowNull: false },
      nominalVoltage: { type: DataTypes.INTEGER, allowNull: false },
      ratedCapacityAh: { type: DataTypes.DOUBLE, allowNull: false },
      usableCapacityAh: { type: DataTypes.DOUBLE, allowNull: false },
      bmsContinuousDischargeA: DataTypes.DOUBLE,
      bmsLowVoltageCutoffV: DataTypes.DOUBLE,
      bmsPeakDischargeA: DataTypes.DOUBLE,
      bmsColdChargeCutoff: DataTypes.BOOLEAN,
      ownerId: { type: DataTypes.UUID, allowNull: false },
      installerCompanyId: DataTypes.UUID,
      // The migration's defaults, written as SQL so a row made here gets exactly the column's default.
      timeZone: { type: DataTypes.TEXT, defaultValue: 'UTC' },
      chargeSources: { type: DataTypes.JSONB, defaultValue: [] },
      flagThresholds: { type: DataTypes.JSONB, defaultValue: {} },
      createdAt: databaseNow(),
      updatedAt: databaseNow(),
    },
    { sequelize, modelName: 'System', tableName: 'systems', underscored: true },
  );
  return { System: BoundSystem };
}

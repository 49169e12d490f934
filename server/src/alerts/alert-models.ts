// Sequelize models of alert events and the notices e-mailed about them (tables from the migrations; never synced).
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
import type { FlagKind, FlagSeverity } from '@cellwarden/shared';
import type { User } from '../accounts/account-models';

/**
 * One flag episode on a system: open while `endedAt` is null (at most one open per kind, a partial unique index).
 * Named SystemAlert beside the API's `AlertEvent`, which is what the dashboard is shown of it.
 */
export class SystemAlert extends Model<InferAttributes<SystemAlert>, InferCreationAttributes<SystemAlert>> {
  declare id: CreationOptional<string>;
  declare systemId: ForeignKey<string>;
  declare kind: FlagKind;
  declare severity: FlagSeverity;
  declare startedAt: Date;
  declare endedAt: CreationOptional<Date | null>;
  declare peakValue: number | null;
  declare unit: CreationOptional<string>;
  declare acknowledgedAt: CreationOptional<Date | null>;
  declare acknowledgedBy: ForeignKey<string> | null;
  declare note: CreationOptional<string | null>;
  declare acknowledger?: NonAttribute<User | null>;
}

/** One e-mail about an alert's start or end, kept to rate-limit a person's notices and never tell one twice. */
export class AlertNotice extends Model<InferAttributes<AlertNotice>, InferCreationAttributes<AlertNotice>> {
  declare id: CreationOptional<string>;
  declare alertId: ForeignKey<string>;
  declare userId: ForeignKey<string>;
  declare transition: 'start' | 'end';
  declare sentAt: CreationOptional<Date>;
}

/** Binds subclasses of SystemAlert and AlertNotice to one Sequelize instance. */
export function defineAlertModels(sequelize: Sequelize) {
  const BoundAlert = class extends SystemAlert {};
  BoundAlert.init(
    {
      id: generatedUuidKey(),
      systemId: { type: DataTypes.UUID, allowNull: false },
      kind: { type: DataTypes.TEXT, allowNull: false },
      severity: { type: DataTypes.TEXT, allowNull: false },
      startedAt: { type: DataTypes.DATE, allowNull: false },
      endedAt: DataTypes.DATE,
      peakValue: DataTypes.DOUBLE,
      unit: { type: DataTypes.TEXT, defaultValue: '' },
      acknowledgedAt: DataTypes.DATE,
      acknowledgedBy: DataTypes.UUID,
      note: DataTypes.TEXT,
    },
    {
      sequelize,
      modelName: 'AlertEvent',
      tableName: 'alert_events',
      underscored: true,
      timestamps: false,
      whereMergeStrategy: 'and',
      // An alert is active (the flag still raised) until it ends; it has no expiry.
      scopes: { active: { where: { endedAt: null } } },
    },
  );
  const BoundNotice = class extends AlertNotice {};
  BoundNotice.init(
    {
      // bigserial: pg hands a bigint back as a string.
      id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
      alertId: { type: DataTypes.UUID, allowNull: false },
      userId: { type: DataTypes.UUID, allowNull: false },
      transition: { type: DataTypes.TEXT, allowNull: false },
      sentAt: databaseNow(),
    },
    { sequelize, modelName: 'AlertNotice', tableName: 'alert_notices', underscored: true, timestamps: false },
  );
  return { SystemAlert: BoundAlert, AlertNotice: BoundNotice };
}

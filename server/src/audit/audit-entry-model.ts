// Sequelize model of the audit trail (table from the migrations; never synced).
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
import { databaseNow } from '../database/columns';
import type { AuditAction } from '@cellwarden/shared';
import type { User } from '../accounts/account-models';

/** One entry of a system's audit trail; `at` is set by the database. */
export class AuditEntryRow extends Model<
  InferAttributes<AuditEntryRow>,
  InferCreationAttributes<AuditEntryRow>
> {
  // bigserial: pg hands int8 over as a string, which is the API's id type too.
  declare id: CreationOptional<string>;
  declare systemId: string;
  declare actorId: ForeignKey<string> | null;
  declare action: AuditAction;
  declare detail: string;
  declare at: CreationOptional<Date>;
  declare actor?: NonAttribute<User | null>;
}

/** Binds a subclass of AuditEntryRow to one Sequelize instance. */
export function defineAuditModels(sequelize: Sequelize) {
  const BoundAuditEntry = class extends AuditEntryRow {};
  BoundAuditEntry.init(
    {
      id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
      systemId: { type: DataTypes.UUID, allowNull: false },
      action: { type: DataTypes.TEXT, allowNull: false },
      detail: { type: DataTypes.TEXT, allowNull: false },
      at: databaseNow(),
    },
    { sequelize, modelName: 'AuditEntry', tableName: 'audit_entries', underscored: true, timestamps: false },
  );
  return { AuditEntry: BoundAuditEntry };
}

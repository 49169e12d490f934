// Sequelize model of a battery monitor's credentials (table from the migrations; never synced).
import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { databaseNow } from '../database/columns';

/** A battery monitor of one system; its id is its MQTT client id, its secret is stored only as a hash. */
export class Device extends Model<InferAttributes<Device>, InferCreationAttributes<Device>> {
  declare id: string;
  declare systemId: ForeignKey<string>;
  declare label: string;
  declare secretHash: string;
  declare revokedAt: CreationOptional<Date | null>;
  declare lastSeenAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/** Binds a subclass of Device to one Sequelize instance. */
export function defineDeviceModels(sequelize: Sequelize) {
  const BoundDevice = class extends Device {};
  BoundDevice.init(
    {
      id: { type: DataTypes.TEXT, primaryKey: true },
      systemId: { type: DataTypes.UUID, allowNull: false },
      label: { type: DataTypes.TEXT, allowNull: false },
      secretHash: { type: DataTypes.TEXT, allowNull: false },
      revokedAt: DataTypes.DATE,
      lastSeenAt: DataTypes.DATE,
      createdAt: databaseNow(),
      updatedAt: databaseNow(),
    },
    {
      sequelize,
      modelName: 'Device',
      tableName: 'devices',
      underscored: true,
      whereMergeStrategy: 'and',
      // A monitor is in service until its credentials are revoked; it has no expiry.
      scopes: { active: { where: { revokedAt: null } } },
    },
  );
  return { Device: BoundDevice };
}

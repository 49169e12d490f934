// Sequelize model of a person's preferences (table from the migrations; never synced).
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
import type { UserPreferences } from '@cellwarden/shared';

/** One person's display unit and the flag kinds they want e-mailed; no row means the defaults. */
export class UserPreference extends Model<
  InferAttributes<UserPreference>,
  InferCreationAttributes<UserPreference>
> {
  declare userId: ForeignKey<string>;
  declare temperatureUnit: UserPreferences['temperatureUnit'];
  declare emailFlags: UserPreferences['emailFlags'];
  declare updatedAt: CreationOptional<Date>;
}

/** Binds a subclass of UserPreference to one Sequelize instance. */
export function definePreferenceModels(sequelize: Sequelize) {
  const BoundUserPreference = class extends UserPreference {};
  BoundUserPreference.init(
    {
      userId: { type: DataTypes.UUID, primaryKey: true },
      temperatureUnit: { type: DataTypes.TEXT, allowNull: false },
      emailFlags: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false },
      updatedAt: databaseNow(),
    },
    {
      sequelize,
      modelName: 'UserPreference',
      tableName: 'user_preferences',
      underscored: true,
      createdAt: false,
    },
  );
  return { UserPreference: BoundUserPreference };
}

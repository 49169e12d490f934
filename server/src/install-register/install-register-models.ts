// Sequelize class models of the install register's two tables, bound per connection by
// server/src/database/models.ts (with their association). The schema comes from the migration; never synced.
import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { databaseNow, generatedUuidKey } from '../database/columns';
import type { ComponentKind, ComponentRatings } from '@cellwarden/shared';

/** One fitted component of a system, its ratings by kind. */
export class InstallComponent extends Model<
  InferAttributes<InstallComponent>,
  InferCreationAttributes<InstallComponent>
> {
  declare id: CreationOptional<string>;
  declare systemId: string;
  declare name: string;
  declare kind: ComponentKind;
  declare ratings: ComponentRatings;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/** One circuit as wired, from its source to the component it feeds. */
export class InstallCircuit extends Model<
  InferAttributes<InstallCircuit>,
  InferCreationAttributes<InstallCircuit>
> {
  declare id: CreationOptional<string>;
  declare systemId: string;
  declare componentId: ForeignKey<InstallComponent['id']>;
  declare name: string;
  declare conductorAwg: string | null;
  declare conductorMm2: number | null;
  declare construction: 'stranded' | 'fine-stranded' | 'solid';
  declare oneWayLengthM: number;
  declare insulationRatingC: 60 | 75 | 90 | 105;
  declare location: 'general' | 'engine-space';
  declare ambientC: number;
  declare bundledConductors: number;
  declare protectionDevice: 'fuse' | 'breaker';
  declare protectionRatingA: number;
  declare protectionType: string;
  declare fuseDistanceM: number | null;
  declare sheathed: boolean;
  declare designCurrentA: number | null;
  declare allowedDropPercent: number;
  declare monitoring: 'battery-feed' | 'source' | 'none';
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

const id = generatedUuidKey();
const stamps = {
  createdAt: databaseNow(),
  updatedAt: databaseNow(),
};
// double precision columns come back from pg as numbers (float8); DataTypes.DOUBLE says so.
const double = (allowNull = false) => ({ type: DataTypes.DOUBLE, allowNull });

/** Binds subclasses of the register's models to one Sequelize instance. */
export function defineInstallRegisterModels(sequelize: Sequelize) {
  const Component = class extends InstallComponent {};
  Component.init(
    {
      id,
      systemId: { type: DataTypes.UUID, allowNull: false },
      name: { type: DataTypes.TEXT, allowNull: false },
      kind: { type: DataTypes.TEXT, allowNull: false },
      ratings: { type: DataTypes.JSONB, allowNull: false },
      ...stamps,
    },
    { sequelize, tableName: 'install_components', modelName: 'InstallComponent', underscored: true },
  );
  const Circuit = class extends InstallCircuit {};
  Circuit.init(
    {
      id,
      systemId: { type: DataTypes.UUID, allowNull: false },
      componentId: { type: DataTypes.UUID, allowNull: false },
      name: { type: DataTypes.TEXT, allowNull: false },
      conductorAwg: { type: DataTypes.TEXT, allowNull: true },
      conductorMm2: double(true),
      construction: { type: DataTypes.TEXT, allowNull: false },
      oneWayLengthM: double(),
      insulationRatingC: { type: DataTypes.INTEGER, allowNull: false },
      location: { type: DataTypes.TEXT, allowNull: false },
      ambientC: double(),
      bundledConductors: { type: DataTypes.INTEGER, allowNull: false },
      protectionDevice: { type: DataTypes.TEXT, allowNull: false },
      protectionRatingA: double(),
      protectionType: { type: DataTypes.TEXT, allowNull: false },
      fuseDistanceM: double(true),
      sheathed: { type: DataTypes.BOOLEAN, allowNull: false },
      designCurrentA: double(true),
      allowedDropPercent: double(),
      monitoring: { type: DataTypes.TEXT, allowNull: false },
      ...stamps,
    },
    { sequelize, tableName: 'install_circuits', modelName: 'InstallCircuit', underscored: true },
  );
  return { InstallComponent: Component, InstallCircuit: Circuit };
}

// Sequelize models of the accounts tables. The schema is the migrations' (db/migrations); these classes only
// describe it, they never `sync()`. Each Sequelize instance gets its own bound subclasses (see
// server/src/database/models.ts), so two nodes in one process never share a connection pool.
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
import type { Role } from '@cellwarden/shared';

/** A company (installer, support desk) people belong to. */
export class Company extends Model<InferAttributes<Company>, InferCreationAttributes<Company>> {
  declare id: CreationOptional<string>;
  declare name: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/** A person who signs in. */
export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<string>;
  declare email: string;
  declare displayName: string;
  declare passwordHash: string;
  declare roles: Role[];
  declare companyId: ForeignKey<string> | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare company?: NonAttribute<Company>;
}

/** Binds subclasses of Company and User to one Sequelize instance. */
export function defineAccountModels(sequelize: Sequelize) {
  const BoundCompany = class extends Company {};
  BoundCompany.init(
    {
      id: generatedUuidKey(),
      name: { type: DataTypes.TEXT, allowNull: false },
      createdAt: databaseNow(),
      updatedAt: databaseNow(),
    },
    { sequelize, modelName: 'Company', tableName: 'companies', underscored: true },
  );
  const BoundUser = class extends User {};
  BoundUser.init(
    {
      id: generatedUuidKey(),
      email: { type: DataTypes.TEXT, allowNull: false },
      displayName: { type: DataTypes.TEXT, allowNull: false },
      passwordHash: { type: DataTypes.TEXT, allowNull: false },
      roles: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false },
      companyId: { type: DataTypes.UUID },
      createdAt: databaseNow(),
      updatedAt: databaseNow(),
    },
    { sequelize, modelName: 'User', tableName: 'users', underscored: true },
  );
  return { Company: BoundCompany, User: BoundUser };
}

// Sequelize models of sign-in sessions and their rotating refresh tokens (tables from the migrations).
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
import type { User } from './account-models';
import { activeOnDatabaseClock } from '../database/active-scope';

/** One sign-in; its id is the refresh-token family id and every access token names it. */
export class SignInSession extends Model<
  InferAttributes<SignInSession>,
  InferCreationAttributes<SignInSession>
> {
  declare id: string;
  declare userId: ForeignKey<string>;
  declare createdAt: CreationOptional<Date>;
  declare endedAt: CreationOptional<Date | null>;
  declare endedReason: CreationOptional<string | null>;
  declare user?: NonAttribute<User>;
}

/** One refresh token, stored only as its SHA-256. */
export class RefreshToken extends Model<
  InferAttributes<RefreshToken>,
  InferCreationAttributes<RefreshToken>
> {
  declare tokenHash: string;
  declare familyId: string;
  declare userId: ForeignKey<string>;
  declare expiresAt: Date;
  declare rotatedAt: CreationOptional<Date | null>;
  declare revokedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
}

/** Binds subclasses of SignInSession and RefreshToken to one Sequelize instance. */
export function defineSessionModels(sequelize: Sequelize) {
  const BoundSession = class extends SignInSession {};
  BoundSession.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true },
      createdAt: databaseNow(),
      endedAt: DataTypes.DATE,
      endedReason: DataTypes.TEXT,
    },
    {
      sequelize,
      modelName: 'SignInSession',
      tableName: 'sign_in_sessions',
      underscored: true,
      updatedAt: false,
      whereMergeStrategy: 'and',
      // A session is open until it is ended; it has no expiry of its own (its refresh tokens do).
      scopes: { active: { where: { endedAt: null } } },
    },
  );
  const BoundRefreshToken = class extends RefreshToken {};
  BoundRefreshToken.init(
    {
      tokenHash: { type: DataTypes.TEXT, primaryKey: true },
      familyId: { type: DataTypes.UUID, allowNull: false },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      rotatedAt: DataTypes.DATE,
      revokedAt: DataTypes.DATE,
      createdAt: databaseNow(),
    },
    {
      sequelize,
      modelName: 'RefreshToken',
      tableName: 'refresh_tokens',
      underscored: true,
      updatedAt: false,
      whereMergeStrategy: 'and',
      // Judged on the database's clock, as every expiry in the schema is.
      scopes: { active: activeOnDatabaseClock('revokedAt') },
    },
  );
  return { SignInSession: BoundSession, RefreshToken: BoundRefreshToken };
}

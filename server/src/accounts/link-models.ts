// Sequelize models of the one-time links e-mailed to people: invitations and password resets.
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
import type { Company } from './account-models';
import { activeOnDatabaseClock } from '../database/active-scope';

/** An invitation to sign up (into a company, or as an owner); the link's token only as a hash. */
export class Invitation extends Model<InferAttributes<Invitation>, InferCreationAttributes<Invitation>> {
  declare id: CreationOptional<string>;
  declare tokenHash: string;
  declare email: string;
  declare roles: Role[];
  declare companyId: ForeignKey<string> | null;
  declare invitedBy: string | null;
  declare expiresAt: Date;
  declare acceptedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare company?: NonAttribute<Company | null>;
}

/** A password-reset link, by hash; used once. */
export class PasswordReset extends Model<
  InferAttributes<PasswordReset>,
  InferCreationAttributes<PasswordReset>
> {
  declare tokenHash: string;
  declare userId: ForeignKey<string>;
  declare expiresAt: Date;
  declare usedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
}

/** Binds subclasses of Invitation and PasswordReset to one Sequelize instance. */
export function defineLinkModels(sequelize: Sequelize) {
  const BoundInvitation = class extends Invitation {};
  BoundInvitation.init(
    {
      id: generatedUuidKey(),
      tokenHash: { type: DataTypes.TEXT, allowNull: false },
      email: { type: DataTypes.TEXT, allowNull: false },
      roles: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false },
      invitedBy: DataTypes.UUID,
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      acceptedAt: DataTypes.DATE,
      createdAt: databaseNow(),
    },
    {
      sequelize,
      modelName: 'Invitation',
      tableName: 'invitations',
      underscored: true,
      updatedAt: false,
      whereMergeStrategy: 'and',
      // Open: not yet accepted and not expired (withdrawing one sets its expiry to now).
      scopes: { active: activeOnDatabaseClock('acceptedAt') },
    },
  );
  const BoundPasswordReset = class extends PasswordReset {};
  BoundPasswordReset.init(
    {
      tokenHash: { type: DataTypes.TEXT, primaryKey: true },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      usedAt: DataTypes.DATE,
      createdAt: databaseNow(),
    },
    {
      sequelize,
      modelName: 'PasswordReset',
      tableName: 'password_resets',
      underscored: true,
      updatedAt: false,
      whereMergeStrategy: 'and',
      scopes: { active: activeOnDatabaseClock('usedAt') },
    },
  );
  return { Invitation: BoundInvitation, PasswordReset: BoundPasswordReset };
}

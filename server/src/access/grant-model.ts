// Sequelize model of a grant of access to a system (table from the migrations; never synced).
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
import type { GrantAccess } from '@cellwarden/shared';
import type { Company, User } from '../accounts/account-models';
import type { System } from '../systems/system-model';
import { activeAt } from '../database/active-scope';

/**
 * One grant: to a company, or to a person by address (`granteeUserId` is filled in once that address has an
 * account). Named AccessGrant beside the API's `Grant`, which is what the dashboard is shown of it.
 */
export class AccessGrant extends Model<InferAttributes<AccessGrant>, InferCreationAttributes<AccessGrant>> {
  declare id: CreationOptional<string>;
  declare systemId: ForeignKey<string>;
  declare granteeCompanyId: ForeignKey<string> | null;
  declare granteeUserId: ForeignKey<string> | null;
  declare granteeEmail: string | null;
  declare access: GrantAccess;
  declare grantedBy: ForeignKey<string>;
  declare expiresAt: Date;
  declare revokedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare system?: NonAttribute<System>;
  declare granter?: NonAttribute<User>;
  declare granteeCompany?: NonAttribute<Company | null>;
  declare granteeUser?: NonAttribute<User | null>;
}

/** Binds a subclass of AccessGrant to one Sequelize instance. */
export function defineGrantModels(sequelize: Sequelize) {
  const BoundGrant = class extends AccessGrant {};
  BoundGrant.init(
    {
      id: generatedUuidKey(),
      systemId: { type: DataTypes.UUID, allowNull: false },
      granteeCompanyId: DataTypes.UUID,
      granteeUserId: DataTypes.UUID,
      granteeEmail: DataTypes.TEXT,
      access: { type: DataTypes.TEXT, allowNull: false },
      grantedBy: { type: DataTypes.UUID, allowNull: false },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      revokedAt: DataTypes.DATE,
      createdAt: databaseNow(),
    },
    {
      sequelize,
      modelName: 'Grant',
      tableName: 'grants',
      underscored: true,
      updatedAt: false,
      whereMergeStrategy: 'and',
      scopes: {
        // Judged at the caller's `now` (epoch ms), as the access rule is: the same instant decides every grant
        // of one request, and tests move it.
        active: activeAt('revokedAt'),
      },
    },
  );
  return { AccessGrant: BoundGrant };
}

// Sequelize models of share codes and access requests (tables from the migrations; never synced).
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
import type { OutgoingAccessRequest } from '@cellwarden/shared';
import type { User } from '../accounts/account-models';
import { activeAt } from '../database/active-scope';

/** A one-use code an owner hands a support person; stored only as its SHA-256. */
export class ShareCode extends Model<InferAttributes<ShareCode>, InferCreationAttributes<ShareCode>> {
  declare id: CreationOptional<string>;
  declare systemId: ForeignKey<string>;
  declare codeHash: string;
  declare createdBy: ForeignKey<string> | null;
  declare createdAt: CreationOptional<Date>;
  declare expiresAt: Date;
  declare usedAt: CreationOptional<Date | null>;
  declare usedBy: ForeignKey<string> | null;
}

/** A support person's request for access to a system (system NULL when what they typed matched nothing). */
export class AccessRequest extends Model<
  InferAttributes<AccessRequest>,
  InferCreationAttributes<AccessRequest>
> {
  declare id: CreationOptional<string>;
  declare requesterId: ForeignKey<string>;
  declare requesterCompanyId: ForeignKey<string> | null;
  declare via: OutgoingAccessRequest['via'];
  declare ownerEmail: string | null;
  declare systemName: string | null;
  declare systemId: ForeignKey<string> | null;
  declare note: CreationOptional<string>;
  declare createdAt: CreationOptional<Date>;
  declare expiresAt: Date;
  declare decision: CreationOptional<'approved' | 'declined' | null>;
  declare decidedAt: CreationOptional<Date | null>;
  declare decidedBy: ForeignKey<string> | null;
  declare grantId: ForeignKey<string> | null;
  declare requester?: NonAttribute<User>;
}

/** Binds subclasses of ShareCode and AccessRequest to one Sequelize instance. */
export function defineAccessRequestModels(sequelize: Sequelize) {
  const BoundShareCode = class extends ShareCode {};
  BoundShareCode.init(
    {
      id: generatedUuidKey(),
      systemId: { type: DataTypes.UUID, allowNull: false },
      codeHash: { type: DataTypes.TEXT, allowNull: false },
      createdBy: DataTypes.UUID,
      createdAt: databaseNow(),
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      usedAt: DataTypes.DATE,
      usedBy: DataTypes.UUID,
    },
    {
      sequelize,
      modelName: 'ShareCode',
      tableName: 'access_share_codes',
      underscored: true,
      updatedAt: false,
      whereMergeStrategy: 'and',
      // Judged at the caller's `now` (epoch ms), as the service's clock is.
      scopes: {
        active: activeAt('usedAt'),
      },
    },
  );
  const BoundRequest = class extends AccessRequest {};
  BoundRequest.init(
    {
      id: generatedUuidKey(),
      requesterId: { type: DataTypes.UUID, allowNull: false },
      requesterCompanyId: DataTypes.UUID,
      via: { type: DataTypes.TEXT, allowNull: false },
      ownerEmail: DataTypes.TEXT,
      systemName: DataTypes.TEXT,
      systemId: DataTypes.UUID,
      note: { type: DataTypes.TEXT, defaultValue: '' },
      createdAt: databaseNow(),
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      decision: DataTypes.TEXT,
      decidedAt: DataTypes.DATE,
      decidedBy: DataTypes.UUID,
      grantId: DataTypes.UUID,
    },
    {
      sequelize,
      modelName: 'AccessRequest',
      tableName: 'access_requests',
      underscored: true,
      updatedAt: false,
      whereMergeStrategy: 'and',
      // Pending = not answered and not lapsed, at the caller's `now` (epoch ms).
      scopes: {
        active: activeAt('decision'),
      },
    },
  );
  return { ShareCode: BoundShareCode, AccessRequest: BoundRequest };
}

// Sequelize model of a system's hand-over to its customer (table from the migrations; never synced).
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
import type { User } from '../accounts/account-models';
import type { System } from '../systems/system-model';
import { activeAt } from '../database/active-scope';

/**
 * A system waiting for the address it was set up for (at most one open per system, a partial unique index).
 * Named Handover beside the API's `SystemHandover`, which is what the customer is shown of it.
 */
export class Handover extends Model<InferAttributes<Handover>, InferCreationAttributes<Handover>> {
  declare id: CreationOptional<string>;
  declare systemId: ForeignKey<string>;
  declare ownerEmail: string;
  declare offeredBy: ForeignKey<string> | null;
  declare createdAt: CreationOptional<Date>;
  declare expiresAt: Date;
  declare acceptedAt: CreationOptional<Date | null>;
  declare acceptedBy: ForeignKey<string> | null;
  declare system?: NonAttribute<System>;
  declare offerer?: NonAttribute<User | null>;
}

/** Binds a subclass of Handover to one Sequelize instance. */
export function defineHandoverModels(sequelize: Sequelize) {
  const BoundHandover = class extends Handover {};
  BoundHandover.init(
    {
      id: generatedUuidKey(),
      systemId: { type: DataTypes.UUID, allowNull: false },
      ownerEmail: { type: DataTypes.TEXT, allowNull: false },
      offeredBy: DataTypes.UUID,
      createdAt: databaseNow(),
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      acceptedAt: DataTypes.DATE,
      acceptedBy: DataTypes.UUID,
    },
    {
      sequelize,
      modelName: 'Handover',
      tableName: 'system_handovers',
      underscored: true,
      updatedAt: false,
      whereMergeStrategy: 'and',
      // Open = not accepted and not lapsed at the caller's `now` (epoch ms), like a grant to an address.
      scopes: {
        active: activeAt('acceptedAt'),
      },
    },
  );
  return { Handover: BoundHandover };
}

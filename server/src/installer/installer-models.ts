// Sequelize models of the installer's tools: commissioning checks, uploaded photos and logs, saved energy budgets
// (tables from the migrations; never synced).
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
import type { CommissioningCheck, CommissioningCheckRequest, EnergyBudgetInput } from '@cellwarden/shared';
import type { User } from '../accounts/account-models';

/** One run of a commissioning check on a charge source: running until it passes, fails or is abandoned. */
export class CommissioningRun extends Model<
  InferAttributes<CommissioningRun>,
  InferCreationAttributes<CommissioningRun>
> {
  declare id: CreationOptional<string>;
  declare systemId: ForeignKey<string>;
  declare installerId: ForeignKey<string>;
  declare request: CommissioningCheckRequest;
  declare status: CommissioningCheck['status'];
  declare progress: CreationOptional<object>;
  declare result: CreationOptional<object | null>;
  declare startedAt: CreationOptional<Date>;
  declare finishedAt: CreationOptional<Date | null>;
  declare installer?: NonAttribute<User>;
}

/** A photo or log attached to a system; the file lives on disk under `storedName`. */
export class Upload extends Model<InferAttributes<Upload>, InferCreationAttributes<Upload>> {
  declare id: CreationOptional<string>;
  declare systemId: ForeignKey<string>;
  declare uploadedBy: ForeignKey<string> | null;
  declare kind: 'photo' | 'log';
  declare fileName: string;
  declare storedName: string;
  declare contentType: string;
  declare bytes: number;
  declare caption: CreationOptional<string>;
  declare uploadedAt: CreationOptional<Date>;
}

/** An energy budget saved for a system (the loads and sources an installer planned with). */
export class SavedBudget extends Model<InferAttributes<SavedBudget>, InferCreationAttributes<SavedBudget>> {
  declare id: CreationOptional<string>;
  declare systemId: ForeignKey<string>;
  declare name: string;
  declare budget: EnergyBudgetInput;
  declare createdBy: ForeignKey<string> | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/** Binds subclasses of CommissioningRun, Upload and SavedBudget to one Sequelize instance. */
export function defineInstallerModels(sequelize: Sequelize) {
  const BoundRun = class extends CommissioningRun {};
  BoundRun.init(
    {
      id: generatedUuidKey(),
      systemId: { type: DataTypes.UUID, allowNull: false },
      installerId: { type: DataTypes.UUID, allowNull: false },
      request: { type: DataTypes.JSONB, allowNull: false },
      status: { type: DataTypes.TEXT, allowNull: false },
      progress: { type: DataTypes.JSONB, defaultValue: {} },
      result: DataTypes.JSONB,
      startedAt: databaseNow(),
      finishedAt: DataTypes.DATE,
    },
    {
      sequelize,
      modelName: 'CommissioningCheck',
      tableName: 'commissioning_checks',
      underscored: true,
      timestamps: false,
      whereMergeStrategy: 'and',
      // Progress and the verdict are written only while the run is running (a restart abandons it first).
      scopes: { running: { where: { status: 'running' } } },
    },
  );
  const BoundUpload = class extends Upload {};
  BoundUpload.init(
    {
      id: generatedUuidKey(),
      systemId: { type: DataTypes.UUID, allowNull: false },
      uploadedBy: DataTypes.UUID,
      kind: { type: DataTypes.TEXT, allowNull: false },
      fileName: { type: DataTypes.TEXT, allowNull: false },
      storedName: { type: DataTypes.TEXT, allowNull: false },
      contentType: { type: DataTypes.TEXT, allowNull: false },
      bytes: { type: DataTypes.INTEGER, allowNull: false },
      caption: { type: DataTypes.TEXT, defaultValue: '' },
      uploadedAt: databaseNow(),
    },
    { sequelize, modelName: 'Upload', tableName: 'uploads', underscored: true, timestamps: false },
  );
  const BoundBudget = class extends SavedBudget {};
  BoundBudget.init(
    {
      id: generatedUuidKey(),
      systemId: { type: DataTypes.UUID, allowNull: false },
      name: { type: DataTypes.TEXT, allowNull: false },
      budget: { type: DataTypes.JSONB, allowNull: false },
      createdBy: DataTypes.UUID,
      createdAt: databaseNow(),
      updatedAt: databaseNow(),
    },
    { sequelize, modelName: 'EnergyBudget', tableName: 'energy_budgets', underscored: true },
  );
  return { CommissioningRun: BoundRun, Upload: BoundUpload, SavedBudget: BoundBudget };
}

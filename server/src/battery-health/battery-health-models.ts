// Sequelize models of the battery-health job's output: capacity samples and per-system checkpoints (tables from
// the migrations; never synced). The rollups they are computed from stay SQL (battery-health-repository.ts).
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
import type { CapacitySample, CapacityTrackerState, LifeCycleState } from '@cellwarden/shared';

/** One capacity estimate of a system's battery, keyed by the system and the minute it ended. */
export class CapacitySampleRow extends Model<
  InferAttributes<CapacitySampleRow>,
  InferCreationAttributes<CapacitySampleRow>
> {
  declare systemId: ForeignKey<string>;
  declare at: Date;
  declare fullAt: Date;
  declare usableAh: number;
  declare sigmaAh: number;
  declare countedAh: number;
  declare socAtEnd: number;
  declare method: CapacitySample['method'];
  declare temperature: number | null;
}

/** How far the health job has consumed one system's rollups, with the state it resumes from. */
export class HealthCheckpointRow extends Model<
  InferAttributes<HealthCheckpointRow>,
  InferCreationAttributes<HealthCheckpointRow>
> {
  declare systemId: ForeignKey<string>;
  declare capacityState: CapacityTrackerState | null;
  declare minutesThrough: Date | null;
  declare lifecycleState: LifeCycleState | null;
  declare hoursThrough: Date | null;
  declare usableAh: number;
  /** bigint: pg hands it back as a string. */
  declare hoursReadingCount: CreationOptional<number | string>;
  declare lateRebuilds: CreationOptional<number>;
  declare coveredFrom: Date | null;
  declare updatedAt: CreationOptional<Date>;
}

/** Binds subclasses of CapacitySampleRow and HealthCheckpointRow to one Sequelize instance. */
export function defineBatteryHealthModels(sequelize: Sequelize) {
  const BoundSample = class extends CapacitySampleRow {};
  BoundSample.init(
    {
      systemId: { type: DataTypes.UUID, primaryKey: true },
      at: { type: DataTypes.DATE, primaryKey: true },
      fullAt: { type: DataTypes.DATE, allowNull: false },
      usableAh: { type: DataTypes.DOUBLE, allowNull: false },
      sigmaAh: { type: DataTypes.DOUBLE, allowNull: false },
      countedAh: { type: DataTypes.DOUBLE, allowNull: false },
      socAtEnd: { type: DataTypes.DOUBLE, allowNull: false },
      method: { type: DataTypes.TEXT, allowNull: false },
      temperature: DataTypes.DOUBLE,
    },
    {
      sequelize,
      modelName: 'CapacitySample',
      tableName: 'battery_capacity_samples',
      underscored: true,
      timestamps: false,
    },
  );
  const BoundCheckpoint = class extends HealthCheckpointRow {};
  BoundCheckpoint.init(
    {
      systemId: { type: DataTypes.UUID, primaryKey: true },
      capacityState: DataTypes.JSONB,
      minutesThrough: DataTypes.DATE,
      lifecycleState: DataTypes.JSONB,
      hoursThrough: DataTypes.DATE,
      usableAh: { type: DataTypes.DOUBLE, allowNull: false },
      hoursReadingCount: { type: DataTypes.BIGINT, defaultValue: 0 },
      lateRebuilds: { type: DataTypes.INTEGER, defaultValue: 0 },
      coveredFrom: DataTypes.DATE,
      updatedAt: databaseNow(),
    },
    {
      sequelize,
      modelName: 'HealthCheckpoint',
      tableName: 'battery_health_checkpoints',
      underscored: true,
      createdAt: false,
    },
  );
  return { CapacitySampleRow: BoundSample, HealthCheckpointRow: BoundCheckpoint };
}

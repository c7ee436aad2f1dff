import type { ModelCalibrations } from '@shared/calibration/calibrations';
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute } from 'sequelize';
import type { Brief, OptimisationResult } from '@shared/schemas/briefs';
import type { RunStatus } from '@shared/schemas/runs';
import type { ChemistryLibrary } from '@shared/chemistry/types';
import type { OptimiserIngredient } from '@shared/optimiser/types';
import { sequelize } from '../db/sequelize';
import { UserRecord } from '../users/user.model';

/** What a run used, frozen when it was queued. */
export interface RunDataSnapshot {
  ingredients: (OptimiserIngredient & { version: number })[];
  chemistry: ChemistryLibrary;
  /** Lab calibrations active when the run was created (lab-logs); absent on older runs. */
  calibrations?: ModelCalibrations;
}

/** The stored result minus the candidates, which are rows of their own. */
export type StoredRunResult = Omit<OptimisationResult, 'candidates'> & { sweep?: unknown };

export class RunRecord extends Model<InferAttributes<RunRecord>, InferCreationAttributes<RunRecord>> {
  declare id: CreationOptional<number>;
  declare workspaceId: number;
  declare briefId: number;
  declare briefVersion: number;
  declare briefSnapshot: Brief;
  declare dataSnapshot: RunDataSnapshot;
  declare status: CreationOptional<RunStatus>;
  declare progressDone: CreationOptional<number>;
  declare progressTotal: CreationOptional<number>;
  declare attempts: CreationOptional<number>;
  declare jobId: CreationOptional<string | null>;
  declare error: CreationOptional<string | null>;
  declare result: CreationOptional<StoredRunResult | null>;
  declare timings: CreationOptional<Record<string, number> | null>;
  declare createdById: number | null;
  declare startedAt: CreationOptional<Date | null>;
  declare finishedAt: CreationOptional<Date | null>;
  /** Written by the executing worker every few seconds; stale means the worker is gone (run-sweeper.ts). */
  declare heartbeatAt: CreationOptional<Date | null>;
  /** How often the run's worker stopped responding and the run was re-queued or failed. */
  declare interruptions: CreationOptional<number>;
  /** The process (host:pid) executing the current attempt. */
  declare workerId: CreationOptional<string | null>;
  /** The queue (RUN_QUEUE) of the worker executing it. */
  declare queueName: CreationOptional<string | null>;
  declare lastInterruptedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare createdBy?: NonAttribute<UserRecord | null>;
}

RunRecord.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    workspaceId: { type: DataTypes.INTEGER, allowNull: false },
    briefId: { type: DataTypes.INTEGER, allowNull: false },
    briefVersion: { type: DataTypes.INTEGER, allowNull: false },
    briefSnapshot: { type: DataTypes.JSONB, allowNull: false },
    dataSnapshot: { type: DataTypes.JSONB, allowNull: false },
    status: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'queued' },
    progressDone: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    progressTotal: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    jobId: { type: DataTypes.STRING(64), allowNull: true },
    error: { type: DataTypes.TEXT, allowNull: true },
    result: { type: DataTypes.JSONB, allowNull: true },
    timings: { type: DataTypes.JSONB, allowNull: true },
    createdById: { type: DataTypes.INTEGER, allowNull: true },
    startedAt: { type: DataTypes.DATE, allowNull: true },
    finishedAt: { type: DataTypes.DATE, allowNull: true },
    heartbeatAt: { type: DataTypes.DATE, allowNull: true },
    interruptions: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    workerId: { type: DataTypes.STRING(120), allowNull: true },
    queueName: { type: DataTypes.STRING(60), allowNull: true },
    lastInterruptedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'runs' },
);
RunRecord.belongsTo(UserRecord, { foreignKey: 'createdById', as: 'createdBy', constraints: false });

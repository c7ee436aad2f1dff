import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import type { ColumnMapping } from '@shared/lab-logs/parse-log';
import type { CalibrationFit } from '@shared/lab-logs/calibrate';
import type { LabScenario } from '@shared/lab-logs/scenario';
import type { LabConditions } from '@shared/schemas/lab-logs';
import { sequelize } from '../db/sequelize';
import { UserRecord } from '../users/user.model';

export class LabLogRecord extends Model<InferAttributes<LabLogRecord>, InferCreationAttributes<LabLogRecord>> {
  declare id: CreationOptional<number>;
  declare workspaceId: number;
  declare candidateId: number | null;
  declare name: string;
  declare notes: string | null;
  declare filename: string;
  declare sizeBytes: number;
  declare sha256: string;
  declare delimiter: string;
  declare headerRow: number | null;
  declare preamble: string[];
  declare startedAtText: string | null;
  declare mapping: ColumnMapping;
  declare channels: string[];
  declare conditions: LabConditions;
  declare scenario: LabScenario;
  /** [[tSec, °C per channel…], …] */
  declare samples: number[][];
  declare sampleCount: number;
  declare fit: CreationOptional<(CalibrationFit & { elapsedMs: number; fittedBy: string }) | null>;
  declare fittedAt: CreationOptional<Date | null>;
  declare createdById: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

LabLogRecord.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    workspaceId: { type: DataTypes.INTEGER, allowNull: false },
    candidateId: { type: DataTypes.INTEGER, allowNull: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    notes: { type: DataTypes.TEXT, allowNull: true },
    filename: { type: DataTypes.STRING(255), allowNull: false },
    sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
    sha256: { type: DataTypes.STRING(64), allowNull: false },
    delimiter: { type: DataTypes.STRING(4), allowNull: false },
    headerRow: { type: DataTypes.INTEGER, allowNull: true },
    preamble: { type: DataTypes.JSONB, allowNull: false },
    startedAtText: { type: DataTypes.STRING(32), allowNull: true },
    mapping: { type: DataTypes.JSONB, allowNull: false },
    channels: { type: DataTypes.JSONB, allowNull: false },
    conditions: { type: DataTypes.JSONB, allowNull: false },
    scenario: { type: DataTypes.JSONB, allowNull: false },
    samples: { type: DataTypes.JSONB, allowNull: false },
    sampleCount: { type: DataTypes.INTEGER, allowNull: false },
    fit: { type: DataTypes.JSONB, allowNull: true },
    fittedAt: { type: DataTypes.DATE, allowNull: true },
    createdById: { type: DataTypes.INTEGER, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'lab_logs' },
);

LabLogRecord.belongsTo(UserRecord, { as: 'createdBy', foreignKey: 'createdById', constraints: false });

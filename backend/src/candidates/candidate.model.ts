import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import type { Candidate } from '@shared/schemas/briefs';
import { sequelize } from '../db/sequelize';

export class CandidateRecord extends Model<InferAttributes<CandidateRecord>, InferCreationAttributes<CandidateRecord>> {
  declare id: CreationOptional<number>;
  declare workspaceId: number;
  declare runId: number;
  declare briefId: number;
  /** The active ingredient ids joined by `+`: unique within a run, so a retried job adds no duplicates. */
  declare setKey: string;
  declare rank: number;
  declare pareto: boolean;
  declare verificationStatus: string;
  declare state: CreationOptional<string>;
  declare data: Candidate;
  declare version: CreationOptional<number>;
  /** The version this one revises (reviews: a change after submission makes a new version). */
  declare parentCandidateId: CreationOptional<number | null>;
  declare revision: CreationOptional<number>;
  /** Set on submission for review; the composition is frozen from then on. */
  declare submittedAt: CreationOptional<Date | null>;
  declare submittedById: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

CandidateRecord.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    workspaceId: { type: DataTypes.INTEGER, allowNull: false },
    runId: { type: DataTypes.INTEGER, allowNull: false },
    briefId: { type: DataTypes.INTEGER, allowNull: false },
    setKey: { type: DataTypes.STRING(400), allowNull: false },
    rank: { type: DataTypes.INTEGER, allowNull: false },
    pareto: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    verificationStatus: { type: DataTypes.STRING(16), allowNull: false },
    state: { type: DataTypes.STRING(24), allowNull: false, defaultValue: 'proposed' },
    data: { type: DataTypes.JSONB, allowNull: false },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    parentCandidateId: { type: DataTypes.INTEGER, allowNull: true },
    revision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    submittedAt: { type: DataTypes.DATE, allowNull: true },
    submittedById: { type: DataTypes.INTEGER, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'candidates' },
);

import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute } from 'sequelize';
import type { ReviewStage, ReviewVerdict } from '@shared/reviews/state-machine';
import { sequelize } from '../db/sequelize';
import { UserRecord } from '../users/user.model';

/** One decision of a chemistry or regulatory review: verdict, checklist, comment, who and when. */
export class ReviewRecordModel extends Model<InferAttributes<ReviewRecordModel>, InferCreationAttributes<ReviewRecordModel>> {
  declare id: CreationOptional<number>;
  declare workspaceId: number;
  declare candidateId: number;
  declare stage: ReviewStage;
  declare verdict: ReviewVerdict;
  declare checklist: Record<string, unknown>;
  declare comment: string;
  declare reviewerId: number | null;
  declare fromState: string;
  declare toState: string;
  declare createdAt: CreationOptional<Date>;
  declare reviewer?: NonAttribute<UserRecord | null>;
}

ReviewRecordModel.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    workspaceId: { type: DataTypes.INTEGER, allowNull: false },
    candidateId: { type: DataTypes.INTEGER, allowNull: false },
    stage: { type: DataTypes.STRING(12), allowNull: false },
    verdict: { type: DataTypes.STRING(20), allowNull: false },
    checklist: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    comment: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    reviewerId: { type: DataTypes.INTEGER, allowNull: true },
    fromState: { type: DataTypes.STRING(24), allowNull: false },
    toState: { type: DataTypes.STRING(24), allowNull: false },
    createdAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  },
  { sequelize, tableName: 'reviews', updatedAt: false },
);

ReviewRecordModel.belongsTo(UserRecord, { foreignKey: 'reviewerId', as: 'reviewer', constraints: false });

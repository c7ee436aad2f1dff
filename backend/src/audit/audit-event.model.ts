import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '../db/sequelize';

/** Who did what to which record, and when. Written in the same transaction as the change. */
export class AuditEventRecord extends Model<InferAttributes<AuditEventRecord>, InferCreationAttributes<AuditEventRecord>> {
  declare id: CreationOptional<number>;
  declare workspaceId: number;
  declare actorId: number | null;
  declare action: string;
  declare entityType: string;
  declare entityId: string | null;
  declare detail: CreationOptional<Record<string, unknown>>;
  declare createdAt: CreationOptional<Date>;
}

AuditEventRecord.init(
  {
    id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
    workspaceId: { type: DataTypes.INTEGER, allowNull: false },
    actorId: { type: DataTypes.INTEGER, allowNull: true },
    action: { type: DataTypes.STRING(80), allowNull: false },
    entityType: { type: DataTypes.STRING(60), allowNull: false },
    entityId: { type: DataTypes.STRING(60), allowNull: true },
    detail: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    createdAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  },
  { sequelize, tableName: 'audit_events', updatedAt: false },
);

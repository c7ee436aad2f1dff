import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { UserRecord } from '../users/user.model';

/** An uploaded file (safety data sheet and similar) kept in PostgreSQL beside its ingredient. */
export class AttachmentRecord extends Model<InferAttributes<AttachmentRecord>, InferCreationAttributes<AttachmentRecord>> {
  declare id: CreationOptional<number>;
  declare workspaceId: number;
  declare ingredientId: number;
  declare filename: string;
  declare contentType: string;
  declare sizeBytes: number;
  declare sha256: string;
  declare bytes: Buffer;
  declare uploadedById: number | null;
  declare createdAt: CreationOptional<Date>;
  declare uploadedBy?: NonAttribute<UserRecord | null>;
}

AttachmentRecord.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    workspaceId: { type: DataTypes.INTEGER, allowNull: false },
    ingredientId: { type: DataTypes.INTEGER, allowNull: false },
    filename: { type: DataTypes.STRING(255), allowNull: false },
    contentType: { type: DataTypes.STRING(100), allowNull: false },
    sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
    sha256: { type: DataTypes.STRING(64), allowNull: false },
    bytes: { type: DataTypes.BLOB, allowNull: false },
    uploadedById: { type: DataTypes.INTEGER, allowNull: true },
    createdAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  },
  { sequelize, tableName: 'attachments', updatedAt: false },
);
AttachmentRecord.belongsTo(UserRecord, { foreignKey: 'uploadedById', as: 'uploadedBy', constraints: false });

import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '../db/sequelize';

/** A message received by the local mail sink (development and tests). */
export class MailMessageRecord extends Model<InferAttributes<MailMessageRecord>, InferCreationAttributes<MailMessageRecord>> {
  declare id: CreationOptional<number>;
  declare workspaceId: number | null;
  declare fromAddress: string;
  declare toAddresses: string[];
  declare subject: string;
  declare text: string;
  declare html: string | null;
  declare receivedAt: CreationOptional<Date>;
}

MailMessageRecord.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    workspaceId: { type: DataTypes.INTEGER, allowNull: true },
    fromAddress: { type: DataTypes.TEXT, allowNull: false },
    toAddresses: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false },
    subject: { type: DataTypes.TEXT, allowNull: false },
    text: { type: DataTypes.TEXT, allowNull: false },
    html: { type: DataTypes.TEXT, allowNull: true },
    receivedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  },
  { sequelize, tableName: 'mail_messages', timestamps: false },
);

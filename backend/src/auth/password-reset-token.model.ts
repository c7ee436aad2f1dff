import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { UserRecord } from '../users/user.model';

export class PasswordResetTokenRecord extends Model<InferAttributes<PasswordResetTokenRecord>, InferCreationAttributes<PasswordResetTokenRecord>> {
  declare id: CreationOptional<number>;
  declare userId: ForeignKey<UserRecord['id']>;
  declare tokenHash: string;
  declare expiresAt: Date;
  declare usedAt: CreationOptional<Date | null>;
  /** Set when a newer request or a successful reset made this link void. */
  declare revokedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

PasswordResetTokenRecord.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    expiresAt: { type: DataTypes.DATE, allowNull: false },
    usedAt: { type: DataTypes.DATE, allowNull: true },
    revokedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'password_reset_tokens' },
);
PasswordResetTokenRecord.belongsTo(UserRecord, { foreignKey: 'userId' });

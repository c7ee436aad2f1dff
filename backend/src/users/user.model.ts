import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute } from 'sequelize';
import type { Role } from '@shared/schemas';
import { sequelize } from '../db/sequelize';
import { Workspace } from '../workspaces/workspace.model';

export class UserRecord extends Model<InferAttributes<UserRecord>, InferCreationAttributes<UserRecord>> {
  declare id: CreationOptional<number>;
  declare workspaceId: ForeignKey<Workspace['id']>;
  declare email: string;
  declare name: string;
  declare passwordHash: string;
  declare role: Role;
  declare disabled: CreationOptional<boolean>;
  declare tokenVersion: CreationOptional<number>;
  declare lastLoginAt: CreationOptional<Date | null>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare workspace?: NonAttribute<Workspace>;
}

UserRecord.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    passwordHash: { type: DataTypes.STRING(100), allowNull: false },
    role: { type: DataTypes.ENUM('designer', 'chemist', 'reviewer', 'admin'), allowNull: false },
    disabled: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    tokenVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    lastLoginAt: { type: DataTypes.DATE, allowNull: true },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'users' },
);

UserRecord.belongsTo(Workspace, { foreignKey: 'workspaceId', as: 'workspace' });
Workspace.hasMany(UserRecord, { foreignKey: 'workspaceId' });

import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute } from 'sequelize';
import type { Role } from '@shared/schemas';
import { sequelize } from '../db/sequelize';
import { Workspace } from '../workspaces/workspace.model';
import { UserRecord } from '../users/user.model';

export class InvitationRecord extends Model<InferAttributes<InvitationRecord>, InferCreationAttributes<InvitationRecord>> {
  declare id: CreationOptional<number>;
  declare workspaceId: ForeignKey<Workspace['id']>;
  declare email: string;
  declare name: string;
  declare role: Role;
  /** SHA-256 of the one-time token; the token itself is only ever in the e-mail. */
  declare tokenHash: string;
  declare invitedById: ForeignKey<UserRecord['id']>;
  declare expiresAt: Date;
  declare acceptedAt: CreationOptional<Date | null>;
  declare revokedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare invitedBy?: NonAttribute<UserRecord>;
  declare workspace?: NonAttribute<Workspace>;
}

InvitationRecord.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    email: { type: DataTypes.STRING(254), allowNull: false },
    name: { type: DataTypes.STRING(120), allowNull: false },
    role: { type: DataTypes.ENUM('designer', 'chemist', 'reviewer', 'admin'), allowNull: false },
    tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    expiresAt: { type: DataTypes.DATE, allowNull: false },
    acceptedAt: { type: DataTypes.DATE, allowNull: true },
    revokedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'invitations' },
);
InvitationRecord.belongsTo(UserRecord, { foreignKey: 'invitedById', as: 'invitedBy' });
InvitationRecord.belongsTo(Workspace, { foreignKey: 'workspaceId', as: 'workspace' });

import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute } from 'sequelize';
import type { Brief } from '@shared/schemas/briefs';
import { sequelize } from '../db/sequelize';
import { UserRecord } from '../users/user.model';

export class BriefRecord extends Model<InferAttributes<BriefRecord>, InferCreationAttributes<BriefRecord>> {
  declare id: CreationOptional<number>;
  declare workspaceId: number;
  declare name: string;
  declare packType: 'cold' | 'warm';
  /** The complete brief, defaults applied (shared briefSchema output). */
  declare spec: Brief;
  declare version: CreationOptional<number>;
  declare createdById: number | null;
  declare updatedById: number | null;
  /** Set while the brief is archived: out of the default list, read-only, still reachable. */
  declare archivedAt: CreationOptional<Date | null>;
  declare archivedById: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare createdBy?: NonAttribute<UserRecord | null>;
  declare updatedBy?: NonAttribute<UserRecord | null>;
  declare archivedBy?: NonAttribute<UserRecord | null>;
}

BriefRecord.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    workspaceId: { type: DataTypes.INTEGER, allowNull: false },
    name: { type: DataTypes.STRING(120), allowNull: false },
    packType: { type: DataTypes.STRING(8), allowNull: false },
    spec: { type: DataTypes.JSONB, allowNull: false },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    createdById: { type: DataTypes.INTEGER, allowNull: true },
    updatedById: { type: DataTypes.INTEGER, allowNull: true },
    archivedAt: { type: DataTypes.DATE, allowNull: true },
    archivedById: { type: DataTypes.INTEGER, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'briefs' },
);
BriefRecord.belongsTo(UserRecord, { foreignKey: 'createdById', as: 'createdBy', constraints: false });
BriefRecord.belongsTo(UserRecord, { foreignKey: 'updatedById', as: 'updatedBy', constraints: false });
BriefRecord.belongsTo(UserRecord, { foreignKey: 'archivedById', as: 'archivedBy', constraints: false });

/** Every saved version of a brief, so a run can always show what it was asked. */
export class BriefVersionRecord extends Model<InferAttributes<BriefVersionRecord>, InferCreationAttributes<BriefVersionRecord>> {
  declare id: CreationOptional<number>;
  declare briefId: number;
  declare version: number;
  declare spec: Brief;
  declare savedById: number | null;
  declare createdAt: CreationOptional<Date>;
}

BriefVersionRecord.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    briefId: { type: DataTypes.INTEGER, allowNull: false },
    version: { type: DataTypes.INTEGER, allowNull: false },
    spec: { type: DataTypes.JSONB, allowNull: false },
    savedById: { type: DataTypes.INTEGER, allowNull: true },
    createdAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'brief_versions', updatedAt: false },
);

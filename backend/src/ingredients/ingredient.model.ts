import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute } from 'sequelize';
import type { IngredientNeed, IngredientRole } from '@shared/schemas';
import type { IngredientHazardData } from '@shared/schemas/hazards';
import type { IngredientProcess } from '@shared/thermal/process';
import { sequelize } from '../db/sequelize';
import { UserRecord } from '../users/user.model';

/** One ingredient of a workspace's library. Soft-deleted (`deletedAt`) so history stays readable. */
export class IngredientRecord extends Model<InferAttributes<IngredientRecord>, InferCreationAttributes<IngredientRecord>> {
  declare id: CreationOptional<number>;
  declare workspaceId: number;
  declare name: string;
  declare grade: CreationOptional<string>;
  declare role: IngredientRole;
  declare speciesKey: CreationOptional<string | null>;
  declare process: CreationOptional<IngredientProcess | null>;
  /** NUMERIC(12,4): PostgreSQL hands it back as a string, and it stays one. */
  declare costPerKg: string;
  declare currency: string;
  declare densityGPerMl: CreationOptional<number | null>;
  declare cpJPerGK: CreationOptional<number | null>;
  declare sources: CreationOptional<string[]>;
  declare notes: CreationOptional<string>;
  /** Ingredients of the same workspace this one needs beside it, g per g of it (migration 0004). */
  declare needs: CreationOptional<IngredientNeed[]>;
  declare version: CreationOptional<number>;
  /** GHS classification, ATE, incompatibility groups and regulatory flags (ingredientHazardDataSchema); null until a chemist enters them. */
  declare hazardData: CreationOptional<IngredientHazardData | null>;
  declare hazardVersion: CreationOptional<number>;
  declare createdById: CreationOptional<number | null>;
  declare updatedById: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare deletedAt: CreationOptional<Date | null>;
  declare createdBy?: NonAttribute<UserRecord | null>;
  declare updatedBy?: NonAttribute<UserRecord | null>;
}

IngredientRecord.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    workspaceId: { type: DataTypes.INTEGER, allowNull: false },
    name: { type: DataTypes.STRING(120), allowNull: false },
    grade: { type: DataTypes.STRING(120), allowNull: false, defaultValue: '' },
    role: { type: DataTypes.ENUM('active', 'solvent', 'additive', 'packaging'), allowNull: false },
    speciesKey: { type: DataTypes.STRING(120), allowNull: true },
    process: { type: DataTypes.JSONB, allowNull: true },
    costPerKg: { type: DataTypes.DECIMAL(12, 4), allowNull: false },
    currency: { type: DataTypes.STRING(3), allowNull: false },
    densityGPerMl: { type: DataTypes.DOUBLE, allowNull: true, field: 'density_g_per_ml' },
    cpJPerGK: { type: DataTypes.DOUBLE, allowNull: true, field: 'cp_j_per_g_k' },
    sources: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    needs: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    hazardData: { type: DataTypes.JSONB, allowNull: true },
    hazardVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    createdById: { type: DataTypes.INTEGER, allowNull: true },
    updatedById: { type: DataTypes.INTEGER, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
    deletedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'ingredients', paranoid: true },
);

IngredientRecord.belongsTo(UserRecord, { foreignKey: 'createdById', as: 'createdBy', constraints: false });
IngredientRecord.belongsTo(UserRecord, { foreignKey: 'updatedById', as: 'updatedBy', constraints: false });

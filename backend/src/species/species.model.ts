import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import type { Phase } from '@shared/chemistry/types';
import { sequelize } from '../db/sequelize';

/**
 * One species row. `workspaceId` null: published reference data (seeded by migration, never edited
 * through the API). Otherwise a workspace's own addition, or its correction of the reference row
 * `correctsId` (same key; it replaces that row for the workspace only).
 */
export class SpeciesRow extends Model<InferAttributes<SpeciesRow>, InferCreationAttributes<SpeciesRow>> {
  declare id: CreationOptional<number>;
  declare workspaceId: number | null;
  declare key: string;
  declare formula: string;
  declare phase: Phase;
  declare name: string;
  declare dfhKjPerMol: number | null;
  declare dfgKjPerMol: number | null;
  declare sJPerMolK: number | null;
  declare cpJPerMolK: number | null;
  declare molarMassGPerMol: number;
  declare source: string;
  declare correctsId: CreationOptional<number | null>;
  declare version: CreationOptional<number>;
  declare createdById: CreationOptional<number | null>;
  declare updatedById: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

SpeciesRow.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    workspaceId: { type: DataTypes.INTEGER, allowNull: true },
    key: { type: DataTypes.STRING(120), allowNull: false },
    formula: { type: DataTypes.STRING(100), allowNull: false },
    phase: { type: DataTypes.STRING(2), allowNull: false },
    name: { type: DataTypes.STRING(200), allowNull: false },
    dfhKjPerMol: { type: DataTypes.DOUBLE, allowNull: true, field: 'dfh_kj_per_mol' },
    dfgKjPerMol: { type: DataTypes.DOUBLE, allowNull: true, field: 'dfg_kj_per_mol' },
    sJPerMolK: { type: DataTypes.DOUBLE, allowNull: true, field: 's_j_per_mol_k' },
    cpJPerMolK: { type: DataTypes.DOUBLE, allowNull: true, field: 'cp_j_per_mol_k' },
    molarMassGPerMol: { type: DataTypes.DOUBLE, allowNull: false, field: 'molar_mass_g_per_mol' },
    source: { type: DataTypes.TEXT, allowNull: false },
    correctsId: { type: DataTypes.INTEGER, allowNull: true },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    createdById: { type: DataTypes.INTEGER, allowNull: true },
    updatedById: { type: DataTypes.INTEGER, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'species' },
);

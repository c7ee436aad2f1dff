import { DataTypes, Model, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '../db/sequelize';

// Tabulated series behind the chemistry computations; `workspaceId` null marks published reference data.

export class DilutionPointRow extends Model<InferAttributes<DilutionPointRow>, InferCreationAttributes<DilutionPointRow>> {
  declare id: number;
  declare workspaceId: number | null;
  declare speciesKey: string;
  /** null: infinite dilution. */
  declare nH2oPerMol: number | null;
  declare dfhKjPerMol: number;
  declare source: string;
}
DilutionPointRow.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    workspaceId: { type: DataTypes.INTEGER, allowNull: true },
    speciesKey: { type: DataTypes.STRING(120), allowNull: false },
    nH2oPerMol: { type: DataTypes.DOUBLE, allowNull: true, field: 'n_h2o_per_mol' },
    dfhKjPerMol: { type: DataTypes.DOUBLE, allowNull: false, field: 'dfh_kj_per_mol' },
    source: { type: DataTypes.TEXT, allowNull: false },
  },
  { sequelize, tableName: 'dilution_points', timestamps: false },
);

export class SolubilityPointRow extends Model<InferAttributes<SolubilityPointRow>, InferCreationAttributes<SolubilityPointRow>> {
  declare id: number;
  declare workspaceId: number | null;
  declare speciesKey: string;
  declare tempC: number;
  declare gPer100gWater: number;
  declare source: string;
}
SolubilityPointRow.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    workspaceId: { type: DataTypes.INTEGER, allowNull: true },
    speciesKey: { type: DataTypes.STRING(120), allowNull: false },
    tempC: { type: DataTypes.DOUBLE, allowNull: false, field: 'temp_c' },
    gPer100gWater: { type: DataTypes.DOUBLE, allowNull: false, field: 'g_per_100g_water' },
    source: { type: DataTypes.TEXT, allowNull: false },
  },
  { sequelize, tableName: 'solubility_points', timestamps: false },
);

export class SolutionHeatCapacityRow extends Model<InferAttributes<SolutionHeatCapacityRow>, InferCreationAttributes<SolutionHeatCapacityRow>> {
  declare id: number;
  declare workspaceId: number | null;
  declare speciesKey: string;
  declare a1: number;
  declare a2: number;
  declare a3: number;
  declare a4: number;
  declare a5: number;
  declare a6: number;
  declare massFractionMax: number;
  declare tempMinC: number;
  declare tempMaxC: number;
  declare pointCount: number | null;
  declare source: string;
}
SolutionHeatCapacityRow.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    workspaceId: { type: DataTypes.INTEGER, allowNull: true },
    speciesKey: { type: DataTypes.STRING(120), allowNull: false },
    a1: { type: DataTypes.DOUBLE, allowNull: false },
    a2: { type: DataTypes.DOUBLE, allowNull: false },
    a3: { type: DataTypes.DOUBLE, allowNull: false },
    a4: { type: DataTypes.DOUBLE, allowNull: false },
    a5: { type: DataTypes.DOUBLE, allowNull: false },
    a6: { type: DataTypes.DOUBLE, allowNull: false },
    massFractionMax: { type: DataTypes.DOUBLE, allowNull: false },
    tempMinC: { type: DataTypes.DOUBLE, allowNull: false, field: 'temp_min_c' },
    tempMaxC: { type: DataTypes.DOUBLE, allowNull: false, field: 'temp_max_c' },
    pointCount: { type: DataTypes.INTEGER, allowNull: true },
    source: { type: DataTypes.TEXT, allowNull: false },
  },
  { sequelize, tableName: 'solution_heat_capacity', timestamps: false },
);

export class FreezingPointRow extends Model<InferAttributes<FreezingPointRow>, InferCreationAttributes<FreezingPointRow>> {
  declare id: number;
  declare workspaceId: number | null;
  declare speciesKey: string;
  declare massFraction: number;
  declare depressionK: number;
  declare source: string;
}
FreezingPointRow.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    workspaceId: { type: DataTypes.INTEGER, allowNull: true },
    speciesKey: { type: DataTypes.STRING(120), allowNull: false },
    massFraction: { type: DataTypes.DOUBLE, allowNull: false },
    depressionK: { type: DataTypes.DOUBLE, allowNull: false, field: 'depression_k' },
    source: { type: DataTypes.TEXT, allowNull: false },
  },
  { sequelize, tableName: 'freezing_points', timestamps: false },
);

export class EutecticRow extends Model<InferAttributes<EutecticRow>, InferCreationAttributes<EutecticRow>> {
  declare id: number;
  declare workspaceId: number | null;
  declare speciesKey: string;
  declare tempC: number;
  declare massFraction: number;
  declare solidPhases: string;
  declare source: string;
}
EutecticRow.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    workspaceId: { type: DataTypes.INTEGER, allowNull: true },
    speciesKey: { type: DataTypes.STRING(120), allowNull: false },
    tempC: { type: DataTypes.DOUBLE, allowNull: false, field: 'temp_c' },
    massFraction: { type: DataTypes.DOUBLE, allowNull: false },
    solidPhases: { type: DataTypes.STRING(200), allowNull: false },
    source: { type: DataTypes.TEXT, allowNull: false },
  },
  { sequelize, tableName: 'eutectics', timestamps: false },
);

import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { IngredientRecord } from '../ingredients/ingredient.model';
import { UserRecord } from '../users/user.model';

export interface CalibrationParameters {
  uaMultiplier?: number;
  rateConstantPerMin?: number;
  enthalpyFactor?: number;
  /** Standard errors of the applied values, same keys. */
  standardErrors?: Record<string, number>;
  rmseK?: number;
}

export class CalibrationRecord extends Model<InferAttributes<CalibrationRecord>, InferCreationAttributes<CalibrationRecord>> {
  declare id: CreationOptional<number>;
  declare workspaceId: number;
  declare scope: 'contact' | 'ingredient';
  declare contactCase: string | null;
  declare ingredientId: number | null;
  declare parameters: CalibrationParameters;
  declare labLogId: number | null;
  declare note: string | null;
  declare active: CreationOptional<boolean>;
  declare appliedById: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

CalibrationRecord.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    workspaceId: { type: DataTypes.INTEGER, allowNull: false },
    scope: { type: DataTypes.STRING(12), allowNull: false },
    contactCase: { type: DataTypes.STRING(24), allowNull: true },
    ingredientId: { type: DataTypes.INTEGER, allowNull: true },
    parameters: { type: DataTypes.JSONB, allowNull: false },
    labLogId: { type: DataTypes.INTEGER, allowNull: true },
    note: { type: DataTypes.TEXT, allowNull: true },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    appliedById: { type: DataTypes.INTEGER, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'calibrations' },
);

CalibrationRecord.belongsTo(UserRecord, { as: 'appliedBy', foreignKey: 'appliedById', constraints: false });
CalibrationRecord.belongsTo(IngredientRecord, { as: 'ingredient', foreignKey: 'ingredientId', constraints: false });

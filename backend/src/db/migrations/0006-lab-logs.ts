import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
};

/** Lab logs (recorded temperature curves with their file metadata, test conditions, samples and fit) and applied calibrations. */
export async function up({ context: { queryInterface: qi } }: { context: MigrationContext }) {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.createTable('lab_logs', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      workspace_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'workspaces', key: 'id' }, onDelete: 'CASCADE' },
      candidate_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'candidates', key: 'id' }, onDelete: 'SET NULL' },
      name: { type: DataTypes.STRING(120), allowNull: false },
      notes: { type: DataTypes.TEXT, allowNull: true },
      // The uploaded file: name, size, SHA-256, what was detected in it.
      filename: { type: DataTypes.STRING(255), allowNull: false },
      size_bytes: { type: DataTypes.INTEGER, allowNull: false },
      sha256: { type: DataTypes.STRING(64), allowNull: false },
      delimiter: { type: DataTypes.STRING(4), allowNull: false },
      header_row: { type: DataTypes.INTEGER, allowNull: true },
      preamble: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      started_at_text: { type: DataTypes.STRING(32), allowNull: true },
      mapping: { type: DataTypes.JSONB, allowNull: false },
      channels: { type: DataTypes.JSONB, allowNull: false },
      // Test conditions (ambient, contact, pack mass) and the mixture as the model reads it.
      conditions: { type: DataTypes.JSONB, allowNull: false },
      scenario: { type: DataTypes.JSONB, allowNull: false },
      // [[tSec, °C per channel…], …]
      samples: { type: DataTypes.JSONB, allowNull: false },
      sample_count: { type: DataTypes.INTEGER, allowNull: false },
      fit: { type: DataTypes.JSONB, allowNull: true },
      fitted_at: { type: DataTypes.DATE, allowNull: true },
      created_by_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' } },
      ...timestamps,
    }, { transaction });
    await qi.addIndex('lab_logs', ['workspace_id', 'candidate_id', 'created_at'], { transaction });

    await qi.createTable('calibrations', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      workspace_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'workspaces', key: 'id' }, onDelete: 'CASCADE' },
      scope: { type: DataTypes.STRING(12), allowNull: false },
      contact_case: { type: DataTypes.STRING(24), allowNull: true },
      ingredient_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'ingredients', key: 'id' }, onDelete: 'CASCADE' },
      parameters: { type: DataTypes.JSONB, allowNull: false },
      lab_log_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'lab_logs', key: 'id' }, onDelete: 'SET NULL' },
      note: { type: DataTypes.TEXT, allowNull: true },
      active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      applied_by_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' } },
      ...timestamps,
    }, { transaction });
    await qi.addIndex('calibrations', ['workspace_id', 'active'], { transaction });
    // At most one active calibration per contact case and per ingredient.
    await qi.sequelize.query(
      `CREATE UNIQUE INDEX calibrations_one_active_target ON calibrations (workspace_id, scope, COALESCE(contact_case, ''), COALESCE(ingredient_id, 0)) WHERE active`,
      { transaction },
    );
  });
}

export async function down({ context: { queryInterface: qi } }: { context: MigrationContext }) {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.dropTable('calibrations', { transaction });
    await qi.dropTable('lab_logs', { transaction });
  });
}

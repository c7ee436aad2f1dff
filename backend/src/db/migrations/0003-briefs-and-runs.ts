import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
};

/** Briefs (with every saved version kept), optimisation runs with their snapshots, and candidates. */
export async function up({ context: { queryInterface: qi } }: { context: MigrationContext }) {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.createTable('briefs', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      workspace_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'workspaces', key: 'id' }, onDelete: 'CASCADE' },
      name: { type: DataTypes.STRING(120), allowNull: false },
      pack_type: { type: DataTypes.STRING(8), allowNull: false },
      spec: { type: DataTypes.JSONB, allowNull: false },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      created_by_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' } },
      updated_by_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' } },
      ...timestamps,
    }, { transaction });
    await qi.addIndex('briefs', ['workspace_id', 'name'], { transaction });

    await qi.createTable('brief_versions', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      brief_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'briefs', key: 'id' }, onDelete: 'CASCADE' },
      version: { type: DataTypes.INTEGER, allowNull: false },
      spec: { type: DataTypes.JSONB, allowNull: false },
      saved_by_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' } },
      created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    }, { transaction });
    await qi.addConstraint('brief_versions', { fields: ['brief_id', 'version'], type: 'unique', name: 'brief_versions_brief_version_unique', transaction });

    await qi.createTable('runs', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      workspace_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'workspaces', key: 'id' }, onDelete: 'CASCADE' },
      brief_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'briefs', key: 'id' }, onDelete: 'CASCADE' },
      brief_version: { type: DataTypes.INTEGER, allowNull: false },
      brief_snapshot: { type: DataTypes.JSONB, allowNull: false },
      // The ingredients and the chemistry library exactly as the run used them.
      data_snapshot: { type: DataTypes.JSONB, allowNull: false },
      status: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'queued' },
      progress_done: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      progress_total: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      job_id: { type: DataTypes.STRING(64), allowNull: true },
      error: { type: DataTypes.TEXT, allowNull: true },
      result: { type: DataTypes.JSONB, allowNull: true },
      timings: { type: DataTypes.JSONB, allowNull: true },
      created_by_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' } },
      started_at: { type: DataTypes.DATE, allowNull: true },
      finished_at: { type: DataTypes.DATE, allowNull: true },
      ...timestamps,
    }, { transaction });
    await qi.addIndex('runs', ['workspace_id', 'brief_id', 'created_at'], { transaction });

    await qi.createTable('candidates', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      workspace_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'workspaces', key: 'id' }, onDelete: 'CASCADE' },
      run_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'runs', key: 'id' }, onDelete: 'CASCADE' },
      brief_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'briefs', key: 'id' }, onDelete: 'CASCADE' },
      set_key: { type: DataTypes.STRING(400), allowNull: false },
      rank: { type: DataTypes.INTEGER, allowNull: false },
      pareto: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      verification_status: { type: DataTypes.STRING(16), allowNull: false },
      state: { type: DataTypes.STRING(24), allowNull: false, defaultValue: 'proposed' },
      data: { type: DataTypes.JSONB, allowNull: false },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      ...timestamps,
    }, { transaction });
    // A retried job cannot store the same set twice.
    await qi.addConstraint('candidates', { fields: ['run_id', 'set_key'], type: 'unique', name: 'candidates_run_set_unique', transaction });
    await qi.addIndex('candidates', ['workspace_id', 'state'], { transaction });
  });
}

export async function down({ context: { queryInterface: qi } }: { context: MigrationContext }) {
  for (const table of ['candidates', 'runs', 'brief_versions', 'briefs']) await qi.dropTable(table);
}

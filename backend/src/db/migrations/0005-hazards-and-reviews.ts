import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

/**
 * Hazard data on ingredients, and the review and sign-off of candidates:
 * - `ingredients.hazard_data` (JSONB, validated by ingredientHazardDataSchema in the service) and
 *   `ingredients.hazard_version` so concurrent hazard edits are caught (409);
 * - candidates carry their revision chain (`parent_candidate_id`, `revision`) and when and by whom
 *   they were submitted (their composition is frozen from then on);
 * - `reviews`: one row per decision of a chemistry or regulatory review.
 */
export async function up({ context: { queryInterface: qi } }: { context: MigrationContext }) {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.addColumn('ingredients', 'hazard_data', { type: DataTypes.JSONB, allowNull: true }, { transaction });
    await qi.addColumn('ingredients', 'hazard_version', { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 }, { transaction });

    await qi.addColumn('candidates', 'parent_candidate_id', { type: DataTypes.INTEGER, allowNull: true, references: { model: 'candidates', key: 'id' }, onDelete: 'SET NULL' }, { transaction });
    await qi.addColumn('candidates', 'revision', { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 }, { transaction });
    await qi.addColumn('candidates', 'submitted_at', { type: DataTypes.DATE, allowNull: true }, { transaction });
    await qi.addColumn('candidates', 'submitted_by_id', { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' } }, { transaction });
    // A revision keeps its run and set: the optimiser's own rows stay unique per run and set (a
    // retried job adds no duplicate), revisions (with a parent) are not bound by it.
    await qi.removeConstraint('candidates', 'candidates_run_set_unique', { transaction });
    await qi.sequelize.query('CREATE UNIQUE INDEX candidates_run_set_unique ON candidates (run_id, set_key) WHERE parent_candidate_id IS NULL', { transaction });
    // One revision per candidate: a second "revise" of the same version cannot slip in.
    await qi.sequelize.query('CREATE UNIQUE INDEX candidates_parent_unique ON candidates (parent_candidate_id) WHERE parent_candidate_id IS NOT NULL', { transaction });
    await qi.sequelize.query(
      `ALTER TABLE candidates ADD CONSTRAINT candidates_state_check CHECK (state IN ('proposed','shortlisted','in-chemistry-review','in-regulatory-review','approved','changes-requested','rejected'))`,
      { transaction },
    );

    await qi.createTable('reviews', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      workspace_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'workspaces', key: 'id' }, onDelete: 'CASCADE' },
      candidate_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'candidates', key: 'id' }, onDelete: 'CASCADE' },
      stage: { type: DataTypes.STRING(12), allowNull: false },
      verdict: { type: DataTypes.STRING(20), allowNull: false },
      checklist: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      comment: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      reviewer_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' } },
      from_state: { type: DataTypes.STRING(24), allowNull: false },
      to_state: { type: DataTypes.STRING(24), allowNull: false },
      created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    }, { transaction });
    await qi.sequelize.query(`ALTER TABLE reviews ADD CONSTRAINT reviews_stage_check CHECK (stage IN ('chemistry','regulatory'))`, { transaction });
    await qi.sequelize.query(`ALTER TABLE reviews ADD CONSTRAINT reviews_verdict_check CHECK (verdict IN ('approved','changes-requested','rejected'))`, { transaction });
    await qi.addIndex('reviews', ['workspace_id', 'candidate_id', 'created_at'], { transaction });
  });
}

export async function down({ context: { queryInterface: qi } }: { context: MigrationContext }) {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.dropTable('reviews', { transaction });
    await qi.sequelize.query('ALTER TABLE candidates DROP CONSTRAINT IF EXISTS candidates_state_check', { transaction });
    await qi.sequelize.query('DROP INDEX IF EXISTS candidates_parent_unique', { transaction });
    await qi.sequelize.query('DROP INDEX IF EXISTS candidates_run_set_unique', { transaction });
    await qi.addConstraint('candidates', { fields: ['run_id', 'set_key'], type: 'unique', name: 'candidates_run_set_unique', transaction });
    for (const column of ['submitted_by_id', 'submitted_at', 'revision', 'parent_candidate_id']) await qi.removeColumn('candidates', column, { transaction });
    await qi.removeColumn('ingredients', 'hazard_version', { transaction });
    await qi.removeColumn('ingredients', 'hazard_data', { transaction });
  });
}

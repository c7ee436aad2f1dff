import type { MigrationContext } from '../migrator';

/**
 * Indexes for the paged lists: briefs by their sort columns within a workspace, candidates by run
 * (the candidate count of each brief's last run) and by parent (the review queue's "already
 * revised" test), and the ingredient library in its default order.
 */
const INDEXES = [
  'CREATE INDEX IF NOT EXISTS briefs_workspace_updated ON briefs (workspace_id, updated_at DESC, id DESC)',
  'CREATE INDEX IF NOT EXISTS briefs_workspace_created ON briefs (workspace_id, created_at DESC, id DESC)',
  'CREATE INDEX IF NOT EXISTS candidates_run ON candidates (run_id)',
  'CREATE INDEX IF NOT EXISTS candidates_workspace_parent ON candidates (workspace_id, parent_candidate_id) WHERE parent_candidate_id IS NOT NULL',
  'CREATE INDEX IF NOT EXISTS ingredients_workspace_name ON ingredients (workspace_id, name, id) WHERE deleted_at IS NULL',
];

export async function up({ context: { queryInterface: qi } }: { context: MigrationContext }) {
  await qi.sequelize.transaction(async (transaction) => {
    for (const sql of INDEXES) await qi.sequelize.query(sql, { transaction });
  });
}

export async function down({ context: { queryInterface: qi } }: { context: MigrationContext }) {
  await qi.sequelize.transaction(async (transaction) => {
    for (const name of ['briefs_workspace_updated', 'briefs_workspace_created', 'candidates_run', 'candidates_workspace_parent', 'ingredients_workspace_name']) {
      await qi.sequelize.query(`DROP INDEX IF EXISTS ${name}`, { transaction });
    }
  });
}

import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

/**
 * Password-reset links can be revoked (by a newer request, or when another link of the user was
 * used), and briefs can be archived instead of deleted (their signed-off candidates are records).
 */
export async function up({ context: { queryInterface: qi } }: { context: MigrationContext }) {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.addColumn('password_reset_tokens', 'revoked_at', { type: DataTypes.DATE, allowNull: true }, { transaction });
    await qi.addColumn('briefs', 'archived_at', { type: DataTypes.DATE, allowNull: true }, { transaction });
    await qi.addColumn('briefs', 'archived_by_id', { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' }, { transaction });
    await qi.addIndex('briefs', ['workspace_id', 'archived_at'], { transaction });
  });
}

export async function down({ context: { queryInterface: qi } }: { context: MigrationContext }) {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.removeIndex('briefs', ['workspace_id', 'archived_at'], { transaction });
    await qi.removeColumn('briefs', 'archived_by_id', { transaction });
    await qi.removeColumn('briefs', 'archived_at', { transaction });
    await qi.removeColumn('password_reset_tokens', 'revoked_at', { transaction });
  });
}

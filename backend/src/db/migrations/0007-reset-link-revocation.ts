import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

/** Password-reset links can be revoked: by a newer request, or when another link of the user was used. */
export async function up({ context: { queryInterface: qi } }: { context: MigrationContext }) {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.addColumn('password_reset_tokens', 'revoked_at', { type: DataTypes.DATE, allowNull: true }, { transaction });
  });
}

export async function down({ context: { queryInterface: qi } }: { context: MigrationContext }) {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.removeColumn('password_reset_tokens', 'revoked_at', { transaction });
  });
}

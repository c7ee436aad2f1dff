import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
};

/** Workspaces, members, one-time tokens, the local mail sink and the audit trail. */
export async function up({ context: { queryInterface: qi } }: { context: MigrationContext }) {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.createTable('workspaces', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      slug: { type: DataTypes.STRING(64), allowNull: false, unique: true },
      name: { type: DataTypes.STRING(120), allowNull: false },
      currency: { type: DataTypes.STRING(3), allowNull: false, defaultValue: 'EUR' },
      ...timestamps,
    }, { transaction });

    await qi.createTable('users', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      workspace_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'workspaces', key: 'id' }, onDelete: 'CASCADE' },
      email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
      name: { type: DataTypes.STRING(120), allowNull: false },
      password_hash: { type: DataTypes.STRING(100), allowNull: false },
      role: { type: DataTypes.ENUM('designer', 'chemist', 'reviewer', 'admin'), allowNull: false },
      disabled: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      // Bumped when a password changes or the user is disabled: older session tokens stop working.
      token_version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      last_login_at: { type: DataTypes.DATE, allowNull: true },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      ...timestamps,
    }, { transaction });
    await qi.addIndex('users', ['workspace_id'], { transaction });

    await qi.createTable('invitations', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      workspace_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'workspaces', key: 'id' }, onDelete: 'CASCADE' },
      email: { type: DataTypes.STRING(254), allowNull: false },
      name: { type: DataTypes.STRING(120), allowNull: false },
      role: { type: DataTypes.ENUM('designer', 'chemist', 'reviewer', 'admin'), allowNull: false },
      token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
      invited_by_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' } },
      expires_at: { type: DataTypes.DATE, allowNull: false },
      accepted_at: { type: DataTypes.DATE, allowNull: true },
      revoked_at: { type: DataTypes.DATE, allowNull: true },
      ...timestamps,
    }, { transaction });
    await qi.addIndex('invitations', ['workspace_id'], { transaction });

    await qi.createTable('password_reset_tokens', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
      token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
      expires_at: { type: DataTypes.DATE, allowNull: false },
      used_at: { type: DataTypes.DATE, allowNull: true },
      ...timestamps,
    }, { transaction });

    await qi.createTable('mail_messages', {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      workspace_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'workspaces', key: 'id' }, onDelete: 'CASCADE' },
      from_address: { type: DataTypes.TEXT, allowNull: false },
      to_addresses: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false },
      subject: { type: DataTypes.TEXT, allowNull: false },
      text: { type: DataTypes.TEXT, allowNull: false },
      html: { type: DataTypes.TEXT, allowNull: true },
      received_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    }, { transaction });
    await qi.addIndex('mail_messages', ['workspace_id', 'received_at'], { transaction });

    await qi.createTable('audit_events', {
      id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
      workspace_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'workspaces', key: 'id' }, onDelete: 'CASCADE' },
      actor_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' } },
      action: { type: DataTypes.STRING(80), allowNull: false },
      entity_type: { type: DataTypes.STRING(60), allowNull: false },
      entity_id: { type: DataTypes.STRING(60), allowNull: true },
      detail: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    }, { transaction });
    await qi.addIndex('audit_events', ['workspace_id', 'entity_type', 'entity_id'], { transaction });
  });
}

export async function down({ context: { queryInterface: qi } }: { context: MigrationContext }) {
  for (const table of ['audit_events', 'mail_messages', 'password_reset_tokens', 'invitations', 'users', 'workspaces']) {
    await qi.dropTable(table);
  }
  await qi.sequelize.query('DROP TYPE IF EXISTS "enum_users_role"; DROP TYPE IF EXISTS "enum_invitations_role";');
}

import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

/**
 * Run heartbeats (DEVELOPERS.md, "Optimisation runs"): the worker executing a run writes
 * `heartbeat_at` every few seconds; a sweeper in every app and worker process re-queues (or, with
 * no attempts left, fails) a running run whose heartbeat is stale. `interruptions` counts how often
 * that happened to the run and `last_interrupted_at` says when, so the run screen can say so;
 * `worker_id` (host:pid) names the process executing the current attempt and `queue_name` the
 * queue it serves (a sweeper re-queues only runs of its own queue).
 */
export async function up({ context: { queryInterface: qi } }: { context: MigrationContext }) {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.addColumn('runs', 'heartbeat_at', { type: DataTypes.DATE, allowNull: true }, { transaction });
    await qi.addColumn('runs', 'worker_id', { type: DataTypes.STRING(120), allowNull: true }, { transaction });
    await qi.addColumn('runs', 'queue_name', { type: DataTypes.STRING(60), allowNull: true }, { transaction });
    await qi.addColumn('runs', 'interruptions', { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 }, { transaction });
    await qi.addColumn('runs', 'last_interrupted_at', { type: DataTypes.DATE, allowNull: true }, { transaction });
    // The sweeper's query reads only running runs.
    await qi.sequelize.query(`CREATE INDEX runs_running_heartbeat ON runs (heartbeat_at) WHERE status = 'running'`, { transaction });
  });
}

export async function down({ context: { queryInterface: qi } }: { context: MigrationContext }) {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.sequelize.query('DROP INDEX IF EXISTS runs_running_heartbeat', { transaction });
    await qi.removeColumn('runs', 'last_interrupted_at', { transaction });
    await qi.removeColumn('runs', 'interruptions', { transaction });
    await qi.removeColumn('runs', 'heartbeat_at', { transaction });
    await qi.removeColumn('runs', 'worker_id', { transaction });
    await qi.removeColumn('runs', 'queue_name', { transaction });
  });
}

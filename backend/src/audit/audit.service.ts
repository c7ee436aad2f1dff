import type { Transaction } from 'sequelize';
import { AuditEventRecord } from './audit-event.model';

export interface AuditEntry {
  workspaceId: number;
  actorId: number | null;
  action: string;
  entityType: string;
  entityId?: string | number | null;
  detail?: Record<string, unknown>;
}

/** Records an audit event; pass the transaction of the change so both land or neither. */
export async function recordAudit(entry: AuditEntry, transaction?: Transaction): Promise<void> {
  await AuditEventRecord.create(
    {
      workspaceId: entry.workspaceId,
      actorId: entry.actorId,
      action: entry.action,
      entityType: entry.entityType,
      entityId: entry.entityId == null ? null : String(entry.entityId),
      detail: entry.detail ?? {},
    },
    { transaction },
  );
}

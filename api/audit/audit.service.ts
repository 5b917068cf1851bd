/** The append-only audit trail: entries are only ever inserted, inside the caller's transaction. */
import type { Transaction } from 'sequelize';
import { AuditEvent } from './audit-event.model';

export interface AuditEntry {
  actorId: number | null;
  action: string;
  entityType: string;
  entityId: number | null;
  before?: unknown;
  after?: unknown;
}

/** Appends one audit entry within the transaction of the change it records. */
export async function recordAudit(entry: AuditEntry, transaction: Transaction): Promise<void> {
  await AuditEvent.create(
    { ...entry, before: entry.before ?? null, after: entry.after ?? null },
    { transaction },
  );
}

/** The newest entries, optionally for one entity. */
export async function listAudit(filter: { entityType?: string; entityId?: number; limit?: number }) {
  const where: Record<string, unknown> = {};
  if (filter.entityType) where.entityType = filter.entityType;
  if (filter.entityId) where.entityId = filter.entityId;
  const rows = await AuditEvent.findAll({ where, order: [['id', 'DESC']], limit: filter.limit ?? 200 });
  return rows.map((r) => ({
    id: r.id, actorId: r.actorId, action: r.action, entityType: r.entityType, entityId: r.entityId,
    before: r.before, after: r.after, createdAt: r.createdAt.toISOString(),
  }));
}

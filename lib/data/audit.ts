import 'server-only';
import type { Transaction } from 'sequelize';
import { getDb } from '@/lib/db';

export type AuditInput = {
  actorUserId: number | null;
  action: string;
  entityType: string;
  entityId: string | number;
  before?: Record<string, unknown> | null;
  after?: Record<string, unknown> | null;
  reason?: string | null;
};

/** Appends to the audit log inside the caller's transaction, so the change and its record land together. */
export async function recordAudit(entry: AuditInput, transaction: Transaction): Promise<void> {
  const { AuditEntry } = getDb().models;
  await AuditEntry.create(
    {
      actorUserId: entry.actorUserId,
      action: entry.action,
      entityType: entry.entityType,
      entityId: String(entry.entityId),
      before: entry.before ?? null,
      after: entry.after ?? null,
      reason: entry.reason ?? null,
    },
    { transaction },
  );
}

export type AuditRow = {
  id: number;
  action: string;
  actorName: string | null;
  before: unknown;
  after: unknown;
  reason: string | null;
  createdAt: Date;
};

export async function listAudit(entityType: string, entityId: string | number, limit = 200): Promise<AuditRow[]> {
  const { AuditEntry, User } = getDb().models;
  const rows = await AuditEntry.findAll({
    where: { entityType, entityId: String(entityId) },
    include: [{ model: User, as: 'actor', attributes: ['name'] }],
    order: [['id', 'DESC']],
    limit,
  });
  return rows.map((r) => {
    const actor = (r as unknown as { actor?: { name: string } }).actor;
    return {
      id: Number(r.id),
      action: r.action,
      actorName: actor?.name ?? null,
      before: r.before,
      after: r.after,
      reason: r.reason ?? null,
      createdAt: r.createdAt,
    };
  });
}

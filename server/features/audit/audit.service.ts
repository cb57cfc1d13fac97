import type { Db, Tx } from '../../db/database';

export interface Actor {
  id: string;
  email: string;
}

export interface AuditEntry {
  actor: Actor | null;
  action: string;
  targetType: string;
  targetId?: string | number | null;
  summary: string;
  before?: unknown;
  after?: unknown;
}

/**
 * Appends one row to the audit trail. Call it inside the same transaction as the change it records,
 * so a change and its audit row land together or not at all. Never pass secrets in before/after.
 */
export async function recordAudit(db: Db | Tx, entry: AuditEntry): Promise<void> {
  await db
    .insertInto('auditEvent')
    .values({
      at: new Date().toISOString(),
      actorId: entry.actor?.id ?? null,
      actorEmail: entry.actor?.email ?? null,
      action: entry.action,
      targetType: entry.targetType,
      targetId: entry.targetId == null ? null : String(entry.targetId),
      summary: entry.summary,
      beforeJson: entry.before === undefined ? null : JSON.stringify(entry.before),
      afterJson: entry.after === undefined ? null : JSON.stringify(entry.after),
    })
    .execute();
}

import type { Selectable } from 'kysely';
import type { AuditEvent } from '../../../shared/contracts/audit';
import type { AuditEventTable } from './audit.table';

// The log keeps what was written then (old spellings included), so its JSON is parsed as it is, without readStoredJson.
const parseJson = (s: string | null): unknown => (s === null ? null : JSON.parse(s));

/** One audit row as the API shows it, with its target's label (null when the target is gone). */
export function toAuditEventView(row: Selectable<AuditEventTable>, targetLabel: string | null): AuditEvent {
  return {
    id: row.id,
    at: row.at,
    actorEmail: row.actorEmail,
    action: row.action,
    targetType: row.targetType,
    targetId: row.targetId,
    targetLabel,
    summary: row.summary,
    before: parseJson(row.beforeJson),
    after: parseJson(row.afterJson),
  };
}

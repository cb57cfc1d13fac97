import type { Generated } from 'kysely';

export interface AuditEventTable {
  id: Generated<number>;
  at: string;
  actorId: string | null;
  actorEmail: string | null;
  action: string;
  targetType: string;
  targetId: string | null;
  summary: string;
  beforeJson: string | null;
  afterJson: string | null;
}

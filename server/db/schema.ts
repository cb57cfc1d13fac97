import type { AuditEventTable } from '../features/audit/audit.table';
import type { SessionTable, UserRoleTable, UserTable } from '../features/users/users.table';

/** The typed database: one entry per table, fed by each feature's *.table.ts (columns in camelCase). */
export interface Database {
  user: UserTable;
  userRole: UserRoleTable;
  session: SessionTable;
  auditEvent: AuditEventTable;
}

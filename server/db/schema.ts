import type { AuditEventTable } from '../features/audit/audit.table';
import type {
  MeasurementSetTable,
  MeasurementSetVersionTable,
  MeasurementSetWithdrawalTable,
  MeasurementRowTable,
} from '../features/measurement-sets/measurement-sets.table';
import type { SubstanceTable } from '../features/substances/substances.table';
import type { FitTable } from '../features/fits/fits.table';
import type {
  ParameterSetCommentTable,
  ParameterSetTable,
  ParameterSetTransitionTable,
} from '../features/parameter-sets/parameter-sets.table';
import type { JobTable } from '../jobs/job.table';
import type { SimulationFramesTable } from '../features/simulations/simulation-frames.table';
import type { NoticeTable } from '../features/notices/notices.table';
import type { PairSetTable } from '../features/pair-sets/pair-sets.table';
import type { MailboxMessageTable, MailOutboxTable } from '../features/mail/mail.table';
import type { SubstanceFollowTable } from '../features/follows/follows.table';
import type { ApiTokenTable } from '../features/tokens/tokens.table';
import type { SessionTable, UserRoleTable, UserTable } from '../features/people/people.table';
import type { SignInFailureTable } from '../features/auth/sign-in-failure.table';

/** The typed database: one entry per table, fed by each feature's *.table.ts (columns in camelCase). */
export interface Database {
  user: UserTable;
  userRole: UserRoleTable;
  session: SessionTable;
  auditEvent: AuditEventTable;
  substance: SubstanceTable;
  measurementSet: MeasurementSetTable;
  measurementSetVersion: MeasurementSetVersionTable;
  measurementRow: MeasurementRowTable;
  measurementSetWithdrawal: MeasurementSetWithdrawalTable;
  job: JobTable;
  simulationFrames: SimulationFramesTable;
  fit: FitTable;
  parameterSet: ParameterSetTable;
  parameterSetTransition: ParameterSetTransitionTable;
  parameterSetComment: ParameterSetCommentTable;
  mailOutbox: MailOutboxTable;
  mailboxMessage: MailboxMessageTable;
  substanceFollow: SubstanceFollowTable;
  apiToken: ApiTokenTable;
  signInFailure: SignInFailureTable;
  notice: NoticeTable;
  pairSet: PairSetTable;
}

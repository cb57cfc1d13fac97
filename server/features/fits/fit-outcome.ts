import type { Db } from '../../db/database';
import { recordAudit } from '../audit/audit.service';
import { mailBody, queueMail } from '../mail/mail.service';
import { addNotice } from '../notices/notices.service';

/**
 * When a fit job ends: one audit row (fit.succeeded / fit.failed), an in-app notice and a mail to the
 * person who started it, all in one transaction. `result` is the fit's result (its status says whether
 * the least squares converged); `error` is set when the job itself stopped with an error.
 */
export async function recordFitOutcome(
  db: Db,
  jobId: number,
  result: { status?: string; failureReason?: string } | null,
  error: string | null,
): Promise<void> {
  const fit = await db
    .selectFrom('fit')
    .innerJoin('substance', 'substance.id', 'fit.substanceId')
    .innerJoin('user', 'user.id', 'fit.createdBy')
    .select(['fit.id', 'fit.number', 'fit.createdBy', 'substance.name as substanceName', 'user.email', 'user.active'])
    .where('fit.jobId', '=', jobId)
    .executeTakeFirst();
  if (!fit) return;
  const succeeded = !error && result?.status === 'succeeded';
  const reason = (error ?? result?.failureReason ?? 'the fit did not converge').replace(/\.$/, '');
  const name = `Fit #${fit.number} of ${fit.substanceName}`;
  const text = succeeded ? `${name} finished.` : `${name} failed: ${reason}.`;
  const link = `/fits/${fit.id}`;
  await db.transaction().execute(async (tx) => {
    await recordAudit(tx, {
      actor: null,
      action: succeeded ? 'fit.succeeded' : 'fit.failed',
      targetType: 'fit',
      targetId: fit.id,
      summary: succeeded ? `${name} finished` : `${name} failed: ${reason}`,
      after: { status: succeeded ? 'succeeded' : 'failed', ...(succeeded ? {} : { reason }) },
    });
    await addNotice(tx, { userId: fit.createdBy, text, link, reason: succeeded ? 'fit.succeeded' : 'fit.failed' });
    if (fit.active) {
      await queueMail(tx, {
        to: [fit.email],
        subject: succeeded ? `Finished: ${name}` : `Failed: ${name}`,
        ...mailBody([
          text,
          succeeded
            ? 'Open the fit to read its values, residuals and warnings.'
            : 'Open the fit to see its last iterate and the per-point misfit.',
        ]),
        link,
        reason: succeeded ? 'fit.succeeded' : 'fit.failed',
      });
    }
  });
}

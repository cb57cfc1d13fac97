import { Router } from 'express';
import { z } from 'zod';
import { mailboxView, outboxView } from '../../../shared/contracts/mail';
import { requirePolicy } from '../../common/auth-middleware';
import { AppError } from '../../common/errors';
import { sendView } from '../../common/respond';
import { validQuery } from '../../common/validate';
import type { AppContext } from '../../app-context';
import { listMailbox, listOutbox, outboxCounts } from './mail.repository';
import { toMailboxMessageView, toOutboxMessageView } from './mail.view';

const mailboxQuery = z.object({
  to: z.string().trim().max(200).optional(),
  limit: z.coerce.number().int().min(1).max(500).default(100),
});

const outboxQuery = z.object({
  status: z.enum(['queued', 'sent', 'failed']).optional(),
  limit: z.coerce.number().int().min(1).max(500).default(100),
});

export function mailRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;

  router.get('/mailbox', requirePolicy('mailbox:read'), async (req, res) => {
    const { to, limit } = validQuery(mailboxQuery, req);
    if (ctx.mail.mode !== 'local') {
      throw new AppError(
        409,
        'mailbox_unavailable',
        'The mailbox only exists with the local mail service; this server sends mail to SMTP_URL.',
      );
    }
    const rows = await listMailbox(db, { to: to || undefined, limit });
    sendView(res, mailboxView, { messages: rows.map(toMailboxMessageView) });
  });

  /** What the app tried to send and how it went; available with the local service and with SMTP_URL. */
  router.get('/mail/outbox', requirePolicy('mailbox:read'), async (req, res) => {
    const { status, limit } = validQuery(outboxQuery, req);
    const rows = await listOutbox(db, { status, limit });
    sendView(res, outboxView, { mode: ctx.mail.mode, counts: await outboxCounts(db), messages: rows.map(toOutboxMessageView) });
  });

  return router;
}

import { Router } from 'express';
import { ipKeyGenerator } from 'express-rate-limit';
import { changePasswordBody, signInBody } from '../../../shared/schemas/people';
import { currentUser, requireUser } from '../../common/auth-middleware';
import { AppError } from '../../common/errors';
import { validBody } from '../../common/validate';
import type { AppContext } from '../../app-context';
import { recordAudit } from '../audit/audit.service';
import { findPersonByEmail, findPersonById } from '../people/people.repository';
import { hashPassword, sessionIdHash, verifyPassword } from './auth';
import { signInLimiter } from './sign-in-limiter';

// A hash of a random string, verified when the e-mail is unknown so the answer takes as long as for a known one.
let decoyHash: Promise<string> | undefined;

export function authRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db, auth } = ctx;

  const limiter = signInLimiter(db, ctx.env.SIGN_IN_LIMIT);

  router.post('/auth/login', async (req, res) => {
    // Validation first: the limiter keys on the e-mail exactly as it is looked up (NFKC, trimmed, lower case).
    const body = validBody(signInBody, req);
    const key = limiter.keyOf(ipKeyGenerator(req.ip ?? req.socket.remoteAddress ?? ''), body.email);
    const waitSeconds = await limiter.begin(key);
    if (waitSeconds > 0) {
      res.set('Retry-After', String(waitSeconds));
      throw new AppError(
        429,
        'too_many_attempts',
        `Too many failed sign-ins for this address. Wait ${Math.ceil(waitSeconds / 60)} minute${waitSeconds > 60 ? 's' : ''} and try again.`,
      );
    }
    const user = await findPersonByEmail(db, body.email);
    let ok = false;
    if (user) ok = await verifyPassword(user.passwordHash, body.password);
    else await verifyPassword(await (decoyHash ??= hashPassword(`decoy-${Math.random()}`)), body.password);
    if (!user || !ok || user.active !== 1) {
      await recordAudit(db, {
        actor: null,
        action: 'auth.sign_in_failed',
        targetType: 'user',
        targetId: user?.id ?? null,
        summary: `Failed sign-in for ${body.email}${user && user.active !== 1 ? ' (account deactivated)' : ''}`,
      });
      throw new AppError(401, 'invalid_credentials', 'E-mail or password is not right.');
    }
    await limiter.clear(key);
    const session = await auth.createSession(user.id, {});
    res.append('Set-Cookie', auth.createSessionCookie(session.id).serialize());
    const roles = await db.selectFrom('userRole').select('role').where('userId', '=', user.id).execute();
    res.json({ id: user.id, email: user.email, name: user.name, roles: roles.map((r) => r.role).sort() });
  });

  router.post('/auth/logout', async (_req, res) => {
    if (res.locals.session) await auth.invalidateSession(res.locals.session.id);
    res.append('Set-Cookie', auth.createBlankSessionCookie().serialize());
    res.status(204).end();
  });

  router.get('/me', requireUser, (_req, res) => {
    const { id, email, name, roles } = currentUser(res);
    res.json({ id, email, name, roles });
  });

  router.post('/me/password', requireUser, async (req, res) => {
    const body = validBody(changePasswordBody, req);
    const me = currentUser(res);
    const row = await findPersonById(db, me.id);
    if (!row || !(await verifyPassword(row.passwordHash, body.currentPassword))) {
      throw new AppError(422, 'wrong_password', 'The current password is not right.', [
        { field: 'currentPassword', message: 'does not match' },
      ]);
    }
    const passwordHash = await hashPassword(body.newPassword);
    await db.transaction().execute(async (tx) => {
      await tx.updateTable('user').set({ passwordHash }).where('id', '=', me.id).execute();
      await recordAudit(tx, {
        actor: me,
        action: 'user.password_changed',
        targetType: 'user',
        targetId: me.id,
        summary: `${me.email} changed their password`,
      });
    });
    // Other sessions of this user end; this one stays.
    await db.deleteFrom('session').where('userId', '=', me.id).where('id', '!=', sessionIdHash(res.locals.session!.id)).execute();
    res.status(204).end();
  });

  return router;
}

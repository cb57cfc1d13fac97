import { randomUUID } from 'node:crypto';
import { Router } from 'express';
import { peopleListView, personView } from '../../../shared/contracts/person';
import { createPersonBody, updatePersonBody } from '../../../shared/schemas/people';
import { currentUser, requirePolicy } from '../../common/auth-middleware';
import { conflict, notFound } from '../../common/errors';
import { sendView } from '../../common/respond';
import { validBody, validParams } from '../../common/validate';
import { z } from 'zod';
import type { AppContext } from '../../app-context';
import { recordAudit } from '../audit/audit.service';
import { hashPassword } from '../auth/auth';
import {
  countActiveAdmins,
  deleteSessionsOf,
  findPersonByEmail,
  findPersonById,
  findPersonWithRoles,
  insertPerson,
  listPeopleWithRoles,
  replaceRoles,
  rolesOf,
  updatePersonColumns,
} from './people.repository';
import { toPersonView } from './people.view';

const personIdParams = z.object({ id: z.string().min(1).max(64) });

/** People administration (admin only). */
export function peopleRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;
  router.use('/people', requirePolicy('people:manage'));

  router.get('/people', async (_req, res) => {
    sendView(res, peopleListView, { people: (await listPeopleWithRoles(db)).map(toPersonView) });
  });

  router.post('/people', async (req, res) => {
    const body = validBody(createPersonBody, req);
    const actor = currentUser(res);
    if (await findPersonByEmail(db, body.email)) {
      throw conflict(`A person with the e-mail ${body.email} already exists.`, [{ field: 'email', message: 'already in use' }]);
    }
    const id = randomUUID();
    const passwordHash = await hashPassword(body.password);
    const roles = [...new Set(body.roles)].sort();
    await db.transaction().execute(async (tx) => {
      await insertPerson(tx, { id, email: body.email, name: body.name, passwordHash, roles });
      await recordAudit(tx, {
        actor,
        action: 'user.created',
        targetType: 'user',
        targetId: id,
        summary: `${actor.email} added ${body.email} with roles ${roles.join(', ')}`,
        after: { email: body.email, name: body.name, roles },
      });
    });
    const created = (await findPersonWithRoles(db, id))!;
    sendView(res, personView, toPersonView(created), 201);
  });

  router.patch('/people/:id', async (req, res) => {
    const { id } = validParams(personIdParams, req);
    const body = validBody(updatePersonBody, req);
    const actor = currentUser(res);
    const target = await findPersonById(db, id);
    if (!target) throw notFound('Person');
    const beforeRoles = await rolesOf(db, id);
    const losesAdmin =
      (body.roles && beforeRoles.includes('admin') && !body.roles.includes('admin')) ||
      (body.active === false && beforeRoles.includes('admin'));
    await db.transaction().execute(async (tx) => {
      if (losesAdmin && target.active === 1 && (await countActiveAdmins(tx)) <= 1) {
        throw conflict('This is the last active admin; give another person the admin role first.');
      }
      if (id === actor.id && body.active === false) throw conflict('You cannot deactivate yourself.');
      const set: { name?: string; active?: number } = {};
      if (body.name !== undefined) set.name = body.name;
      if (body.active !== undefined) set.active = body.active ? 1 : 0;
      await updatePersonColumns(tx, id, set);
      if (body.roles) await replaceRoles(tx, id, [...new Set(body.roles)].sort());
      if (body.active === false) await deleteSessionsOf(tx, id);
      const before = { name: target.name, active: target.active === 1, roles: beforeRoles };
      const after = {
        name: body.name ?? target.name,
        active: body.active ?? target.active === 1,
        roles: body.roles ? [...new Set(body.roles)].sort() : beforeRoles,
      };
      const changes = [
        body.roles && `roles ${beforeRoles.join(', ')} → ${after.roles.join(', ')}`,
        body.active !== undefined && before.active !== after.active && (after.active ? 'reactivated' : 'deactivated'),
        body.name !== undefined && before.name !== after.name && `renamed to ${after.name}`,
      ].filter(Boolean);
      await recordAudit(tx, {
        actor,
        action: body.roles ? 'user.roles_changed' : 'user.updated',
        targetType: 'user',
        targetId: id,
        summary: `${actor.email} updated ${target.email}: ${changes.join('; ') || 'no change'}`,
        before,
        after,
      });
    });
    const updated = (await findPersonWithRoles(db, id))!;
    sendView(res, personView, toPersonView(updated));
  });

  return router;
}

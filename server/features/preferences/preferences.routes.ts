import { Router } from 'express';
import { preferencesView, type PreferencesView } from '../../../shared/contracts/preferences';
import { updatePreferencesBody } from '../../../shared/schemas/preferences';
import type { AppContext } from '../../app-context';
import { currentUser, requireUser } from '../../common/auth-middleware';
import { sendView } from '../../common/respond';
import { validBody } from '../../common/validate';
import type { Db } from '../../db/database';
import { preferencesRowOf, setPreferencesJson } from './preferences.repository';
import { readStoredPreferences, toPreferencesView } from './preferences.view';

/** The person's preferences (defaults for unset or invalid keys). */
export async function readPreferences(db: Db, userId: string): Promise<PreferencesView> {
  return toPreferencesView(await preferencesRowOf(db, userId));
}

/** GET/PUT /api/me/preferences: units and "my simulation uses" scheme of the parameter card, per person. */
export function preferenceRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;

  router.get('/me/preferences', requireUser, async (_req, res) => {
    sendView(res, preferencesView, await readPreferences(db, currentUser(res).id));
  });

  router.put('/me/preferences', requireUser, async (req, res) => {
    const body = validBody(updatePreferencesBody, req);
    const user = currentUser(res);
    await db.transaction().execute(async (tx) => {
      const stored = readStoredPreferences((await preferencesRowOf(tx, user.id))?.preferencesJson);
      // Keys of other features in the same column are kept as they are.
      const merged: Record<string, unknown> = { ...stored, ...body };
      if (body.scheme === null) delete merged.scheme;
      await setPreferencesJson(tx, user.id, JSON.stringify(merged));
    });
    sendView(res, preferencesView, await readPreferences(db, user.id));
  });

  return router;
}

import { Router } from 'express';
import { DEFAULT_PREFERENCES, preferencesSchema, updatePreferencesBody, type Preferences } from '../../../shared/schemas/preferences';
import type { AppContext } from '../../app-context';
import { currentUser, requireUser } from '../../common/auth-middleware';
import { validBody } from '../../common/validate';
import type { Db } from '../../db/database';

/**
 * The stored preferences, read leniently: the JSON column may hold keys of older or other features, so
 * each known key is kept when valid and replaced by its default when not.
 */
export async function readPreferences(db: Db, userId: string): Promise<Preferences> {
  const row = await db.selectFrom('user').select('preferencesJson').where('id', '=', userId).executeTakeFirst();
  let raw: Record<string, unknown> = {};
  try {
    const parsed = JSON.parse(row?.preferencesJson ?? '{}');
    if (parsed && typeof parsed === 'object' && !Array.isArray(parsed)) raw = parsed;
  } catch {
    raw = {};
  }
  const shape = preferencesSchema.shape;
  const energy = shape.energyUnit.safeParse(raw.energyUnit);
  const length = shape.lengthUnit.safeParse(raw.lengthUnit);
  const scheme = shape.scheme.safeParse(raw.scheme);
  return {
    energyUnit: energy.success ? energy.data : DEFAULT_PREFERENCES.energyUnit,
    lengthUnit: length.success ? length.data : DEFAULT_PREFERENCES.lengthUnit,
    ...(scheme.success && scheme.data ? { scheme: scheme.data } : {}),
  };
}

/** GET/PUT /api/me/preferences: units and "my simulation uses" scheme of the parameter card, per person. */
export function preferenceRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;

  router.get('/me/preferences', requireUser, async (_req, res) => {
    res.json(await readPreferences(db, currentUser(res).id));
  });

  router.put('/me/preferences', requireUser, async (req, res) => {
    const body = validBody(updatePreferencesBody, req);
    const user = currentUser(res);
    await db.transaction().execute(async (tx) => {
      const row = await tx.selectFrom('user').select('preferencesJson').where('id', '=', user.id).executeTakeFirstOrThrow();
      let stored: Record<string, unknown> = {};
      try {
        const parsed = JSON.parse(row.preferencesJson);
        if (parsed && typeof parsed === 'object' && !Array.isArray(parsed)) stored = parsed;
      } catch {
        stored = {};
      }
      // Keys of other features in the same column are kept as they are.
      const merged: Record<string, unknown> = { ...stored, ...body };
      if (body.scheme === null) delete merged.scheme;
      await tx.updateTable('user').set({ preferencesJson: JSON.stringify(merged) }).where('id', '=', user.id).execute();
    });
    res.json(await readPreferences(db, user.id));
  });

  return router;
}

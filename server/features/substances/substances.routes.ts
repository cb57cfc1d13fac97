import { Router } from 'express';
import { createSubstanceBody, molarMassWarnings, updateSubstanceBody } from '../../../shared/schemas/measurements';
import { hasPolicy } from '../../../shared/auth/roles';
import { currentUser, requirePolicy } from '../../common/auth-middleware';
import { conflict, notFound } from '../../common/errors';
import { sendView } from '../../common/respond';
import { substanceDetailView, substanceListView, substanceWriteView } from '../../../shared/contracts/substance';
import { idParams, validBody, validParams } from '../../common/validate';
import type { AppContext } from '../../app-context';
import { recordAudit } from '../audit/audit.service';
import { listMeasurementSetsOfSubstance } from '../measurement-sets/measurement-sets.repository';
import { toMeasurementSetSummaryView } from '../measurement-sets/measurement-sets.view';
import {
  countMeasurementSetsOf,
  findSubstance,
  findSubstanceByName,
  insertSubstance,
  listSubstances,
  updateSubstance,
} from './substances.repository';
import { toSubstanceListItemView, toSubstanceView } from './substances.view';

export function substanceRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;

  router.get('/substances', requirePolicy('substance:read'), async (_req, res) => {
    const rows = await listSubstances(db);
    // How many measurement sets of which kinds exist is unpublished work too: only for the roles that read them.
    const withMeasurementSets = hasPolicy(currentUser(res).roles, 'measurement-set:read');
    sendView(res, substanceListView, { substances: rows.map((s) => toSubstanceListItemView(s, withMeasurementSets)) });
  });

  router.post('/substances', requirePolicy('substance:write'), async (req, res) => {
    const body = validBody(createSubstanceBody, req);
    const actor = currentUser(res);
    const now = new Date().toISOString();
    const created = await db.transaction().execute(async (tx) => {
      if (await findSubstanceByName(tx, body.name)) {
        throw conflict(`A substance named "${body.name}" already exists.`, [{ field: 'name', message: 'already in use' }]);
      }
      const row = await insertSubstance(tx, {
        name: body.name,
        formula: body.formula ?? null,
        description: body.description ?? null,
        molarMassGramsPerMol: body.molarMassGPerMol,
        createdBy: actor.id,
        createdAt: now,
        updatedAt: now,
      });
      await recordAudit(tx, {
        actor,
        action: 'substance.created',
        targetType: 'substance',
        targetId: row.id,
        summary: `${actor.email} created substance ${row.name}`,
        after: toSubstanceView(row),
      });
      return row;
    });
    sendView(res, substanceWriteView, { ...toSubstanceView(created), warnings: molarMassWarnings(body.molarMassGPerMol) }, 201);
  });

  router.get('/substances/:id', requirePolicy('substance:read'), async (req, res) => {
    const { id } = validParams(idParams, req);
    const substance = await findSubstance(db, id);
    if (!substance) throw notFound(`Substance ${id}`);
    // Measurement sets are unpublished work: only the roles that may read them get the list.
    if (!hasPolicy(currentUser(res).roles, 'measurement-set:read'))
      return sendView(res, substanceDetailView, { ...toSubstanceView(substance), createdByName: substance.createdByName });
    const measurementSets = await listMeasurementSetsOfSubstance(db, id);
    sendView(res, substanceDetailView, {
      ...toSubstanceView(substance),
      createdByName: substance.createdByName,
      measurementSets: measurementSets.map(toMeasurementSetSummaryView),
    });
  });

  router.patch('/substances/:id', requirePolicy('substance:write'), async (req, res) => {
    const { id } = validParams(idParams, req);
    const body = validBody(updateSubstanceBody, req);
    const actor = currentUser(res);
    const updated = await db.transaction().execute(async (tx) => {
      const before = await findSubstance(tx, id);
      if (!before) throw notFound(`Substance ${id}`);
      const sameName = body.name ? await findSubstanceByName(tx, body.name) : undefined;
      if (sameName && sameName.id !== id) {
        throw conflict(`A substance named "${body.name}" already exists.`, [{ field: 'name', message: 'already in use' }]);
      }
      // The molar mass converts molar densities at upload, so it is fixed once measurements exist.
      if (
        body.molarMassGPerMol !== undefined &&
        body.molarMassGPerMol !== before.molarMassGramsPerMol &&
        (await countMeasurementSetsOf(tx, id)) > 0
      ) {
        throw conflict('The molar mass cannot change once the substance has measurement sets: stored densities depend on it.', [
          { field: 'molarMassGPerMol', message: 'fixed once measurement sets exist' },
        ]);
      }
      const row = await updateSubstance(tx, id, {
        ...(body.name !== undefined ? { name: body.name } : {}),
        ...(body.formula !== undefined ? { formula: body.formula || null } : {}),
        ...(body.description !== undefined ? { description: body.description || null } : {}),
        ...(body.molarMassGPerMol !== undefined ? { molarMassGramsPerMol: body.molarMassGPerMol } : {}),
        updatedAt: new Date().toISOString(),
      });
      await recordAudit(tx, {
        actor,
        action: 'substance.updated',
        targetType: 'substance',
        targetId: id,
        summary: `${actor.email} edited substance ${row.name}`,
        before: toSubstanceView(before),
        after: toSubstanceView(row),
      });
      return row;
    });
    sendView(res, substanceWriteView, { ...toSubstanceView(updated), warnings: molarMassWarnings(body.molarMassGPerMol) });
  });

  return router;
}

import { Router } from 'express';
import { createSimulationBody, simulationsFromMeasurementSetBody } from '../../../shared/schemas/simulations';
import type { AppContext } from '../../app-context';
import { currentUser, requirePolicy } from '../../common/auth-middleware';
import { conflict, notFound } from '../../common/errors';
import { idParams, validBody, validParams } from '../../common/validate';
import { recordAudit } from '../audit/audit.service';
import { createSimulation, createSimulationsFromMeasurementSet, listSimulations, toSimulationView } from './simulations.service';

export function simulationRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;

  const load = async (id: number) => {
    const row = await db.selectFrom('job').selectAll().where('id', '=', id).where('kind', '=', 'simulation').executeTakeFirst();
    if (!row) throw notFound(`Simulation ${id}`);
    return row;
  };

  router.get('/simulations', requirePolicy('simulation:read'), async (_req, res) => {
    res.json({ simulations: await listSimulations(db) });
  });

  /** The queue as the admin sees it: driver, waiting/active/delayed per lane, and the live worker processes. */
  router.get('/simulations/queue', requirePolicy('simulation:read'), async (_req, res) => {
    res.json({ queue: await ctx.jobs.health() });
  });

  router.post('/simulations', requirePolicy('simulation:run'), async (req, res) => {
    const body = validBody(createSimulationBody, req);
    res.status(202).json(await createSimulation(ctx, currentUser(res), body));
  });

  router.post('/simulations/from-measurement-set', requirePolicy('simulation:run'), async (req, res) => {
    const body = validBody(simulationsFromMeasurementSetBody, req);
    res.status(202).json(await createSimulationsFromMeasurementSet(ctx, currentUser(res), body));
  });

  router.get('/simulations/:id', requirePolicy('simulation:read'), async (req, res) => {
    const { id } = validParams(idParams, req);
    res.json(toSimulationView(await load(id), { withTrace: true }));
  });

  router.post('/simulations/:id/cancel', requirePolicy('simulation:run'), async (req, res) => {
    const { id } = validParams(idParams, req);
    await load(id);
    if (!(await ctx.jobs.cancel(id))) throw conflict('Only a queued or running simulation can be cancelled.');
    const actor = currentUser(res);
    await recordAudit(db, { actor, action: 'simulation.cancelled', targetType: 'job', targetId: id, summary: `${actor.email} cancelled simulation ${id}` });
    res.json(toSimulationView(await load(id), { withTrace: false }));
  });

  router.post('/simulations/:id/retry', requirePolicy('simulation:run'), async (req, res) => {
    const { id } = validParams(idParams, req);
    await load(id);
    if (!(await ctx.jobs.retry(id))) throw conflict('Only a failed or cancelled simulation can be retried.');
    res.status(202).json(toSimulationView(await load(id), { withTrace: false }));
  });

  return router;
}

import { Router } from 'express';
import { createSimulationBody, simulationsFromMeasurementSetBody } from '../../../shared/schemas/simulations';
import type { AppContext } from '../../app-context';
import { currentUser, requirePolicy } from '../../common/auth-middleware';
import { conflict, notFound } from '../../common/errors';
import { idParams, validBody, validParams } from '../../common/validate';
import { recordAudit } from '../audit/audit.service';
import {
  queueView,
  simulationListView,
  simulationStartView,
  simulationsFromMeasurementSetView,
  simulationView,
} from '../../../shared/contracts/simulation';
import { sendView } from '../../common/respond';
import { findSimulationJob } from './simulations.repository';
import { createSimulation, createSimulationsFromMeasurementSet, listSimulations } from './simulations.service';
import { toSimulationView } from './simulations.view';

export function simulationRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;

  const load = async (id: number) => {
    const row = await findSimulationJob(db, id);
    if (!row) throw notFound(`Simulation ${id}`);
    return row;
  };

  router.get('/simulations', requirePolicy('simulation:read'), async (_req, res) => {
    sendView(res, simulationListView, { simulations: await listSimulations(db) });
  });

  /** The queue as the admin sees it: driver, waiting/active/delayed per lane, and the live worker processes. */
  router.get('/simulations/queue', requirePolicy('simulation:read'), async (_req, res) => {
    sendView(res, queueView, { queue: await ctx.jobs.health() });
  });

  router.post('/simulations', requirePolicy('simulation:run'), async (req, res) => {
    const body = validBody(createSimulationBody, req);
    sendView(res, simulationStartView, await createSimulation(ctx, currentUser(res), body), 202);
  });

  router.post('/simulations/from-measurement-set', requirePolicy('simulation:run'), async (req, res) => {
    const body = validBody(simulationsFromMeasurementSetBody, req);
    sendView(res, simulationsFromMeasurementSetView, await createSimulationsFromMeasurementSet(ctx, currentUser(res), body), 202);
  });

  router.get('/simulations/:id', requirePolicy('simulation:read'), async (req, res) => {
    const { id } = validParams(idParams, req);
    sendView(res, simulationView, toSimulationView(await load(id), { withTrace: true }));
  });

  router.post('/simulations/:id/cancel', requirePolicy('simulation:run'), async (req, res) => {
    const { id } = validParams(idParams, req);
    await load(id);
    if (!(await ctx.jobs.cancel(id))) throw conflict('Only a queued or running simulation can be cancelled.');
    const actor = currentUser(res);
    await recordAudit(db, {
      actor,
      action: 'simulation.cancelled',
      targetType: 'job',
      targetId: id,
      summary: `${actor.email} cancelled simulation ${id}`,
    });
    sendView(res, simulationView, toSimulationView(await load(id), { withTrace: false }));
  });

  router.post('/simulations/:id/retry', requirePolicy('simulation:run'), async (req, res) => {
    const { id } = validParams(idParams, req);
    await load(id);
    if (!(await ctx.jobs.retry(id))) throw conflict('Only a failed or cancelled simulation can be retried.');
    sendView(res, simulationView, toSimulationView(await load(id), { withTrace: false }), 202);
  });

  return router;
}

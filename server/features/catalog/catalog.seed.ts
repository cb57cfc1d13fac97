import { DEMO_PEOPLE, DEMO_SUBSTANCES } from '../../../fixtures/demo/scenario';
import { fitLennardJones, type FitMeasurementSet, type LjFitOptions } from '../../../shared/fitting/lj-fit';
import type { AppContext } from '../../app-context';
import type { CurrentUser } from '../../common/auth-middleware';
import { recordAudit } from '../audit/audit.service';
import { loadVersionForFit } from '../measurement-sets/measurement-sets.service';
import type { FitMeasurementSetRef, FitJobInput } from '../fits/fits.service';
import { createParameterSet, reviewParameterSet, submitParameterSet } from '../parameter-sets/parameter-sets.service';
import { findPersonByEmail, rolesOf } from '../people/people.repository';

async function demoPerson(ctx: AppContext, role: 'modeller' | 'reviewer'): Promise<CurrentUser | null> {
  const email = DEMO_PEOPLE.find((p) => p.roles.includes(role))?.email;
  const row = email ? await findPersonByEmail(ctx.db, email) : undefined;
  return row ? { id: row.id, email: row.email, name: row.name, roles: await rolesOf(ctx.db, row.id) } : null;
}

/**
 * Gives the demo catalog something to show: for each demo substance, a real fit of its B2 and viscosity
 * tables (run here, in-process, with the same fitLennardJones the worker runs), stored as a succeeded job
 * and fit, then a parameter set drafted by the demo modeller, submitted, and approved by the demo reviewer
 * through the parameter-set services, so the history, audit trail and mail are those of a real review.
 * Runs only on a database without fits (right after the demo seed). Density tables need simulations and
 * are left for the modeller to fit in the demo.
 */
export async function seedApprovedDemoSets(ctx: AppContext): Promise<number> {
  const { db } = ctx;
  const anyFit = await db.selectFrom('fit').select('id').limit(1).executeTakeFirst();
  if (anyFit) return 0;
  const modeller = await demoPerson(ctx, 'modeller');
  const reviewer = await demoPerson(ctx, 'reviewer');
  if (!modeller || !reviewer) return 0;
  let approved = 0;
  for (const demo of DEMO_SUBSTANCES) {
    const substance = await db.selectFrom('substance').select(['id', 'molarMassGramsPerMol']).where('name', '=', demo.name).executeTakeFirst();
    if (!substance) continue;
    const versions = await db
      .selectFrom('measurementSet')
      .innerJoin('measurementSetVersion', 'measurementSetVersion.measurementSetId', 'measurementSet.id')
      .select(['measurementSet.id as measurementSetId', 'measurementSet.name', 'measurementSet.kind', 'measurementSetVersion.id as versionId', 'measurementSetVersion.version'])
      .where('measurementSet.substanceId', '=', substance.id)
      .where('measurementSet.kind', 'in', ['b2', 'viscosity'])
      .orderBy('measurementSet.id')
      .orderBy('measurementSetVersion.version', 'desc')
      .execute();
    const latest = versions.filter((v, k) => k === 0 || versions[k - 1].measurementSetId !== v.measurementSetId);
    if (!latest.length) continue;
    const refs: FitMeasurementSetRef[] = latest.map((v) => ({ measurementSetId: v.measurementSetId, version: v.version, versionId: v.versionId, kind: v.kind, name: v.name, weight: 1 }));
    const measurementSets: FitMeasurementSet[] = [];
    for (const ref of refs) {
      const rows = await loadVersionForFit(db, ref.versionId);
      measurementSets.push({
        id: ref.measurementSetId,
        version: ref.version,
        kind: ref.kind as FitMeasurementSet['kind'],
        weight: 1,
        label: ref.name,
        rows: rows.map((r) => ({ temperatureK: r.temperatureK, ...(r.pressureMPa !== null ? { pressureMPa: r.pressureMPa } : {}), value: r.value, uncertainty: r.uncertainty })),
      });
    }
    const options: LjFitOptions = { molarMassGPerMol: substance.molarMassGramsPerMol };
    const started = new Date().toISOString();
    const result = fitLennardJones(measurementSets, options);
    if (result.status !== 'succeeded') continue;
    const finished = new Date().toISOString();
    const input: FitJobInput = { measurementSets: refs, options, createdBy: modeller.id };
    const fitId = await db.transaction().execute(async (tx) => {
      const job = await tx
        .insertInto('job')
        .values({ kind: 'fit', status: 'succeeded', progress: 1, stage: null, inputJson: JSON.stringify(input), resultJson: JSON.stringify(result), seed: 0, createdBy: modeller.id, createdAt: started, startedAt: started, finishedAt: finished, updatedAt: finished })
        .returning('id')
        .executeTakeFirstOrThrow();
      const fit = await tx
        .insertInto('fit')
        .values({ substanceId: substance.id, number: 1, jobId: job.id, model: 'lj-12-6', measurementSetsJson: JSON.stringify(refs), optionsJson: JSON.stringify(options), codeVersion: ctx.codeVersion, createdBy: modeller.id, createdAt: started })
        .returning('id')
        .executeTakeFirstOrThrow();
      await recordAudit(tx, { actor: modeller, action: 'fit.started', targetType: 'fit', targetId: fit.id, summary: `Demo seed ran Fit #1 of ${demo.name} on ${refs.map((r) => `${r.name} v${r.version}`).join(', ')}`, after: { measurementSets: refs, options } });
      return fit.id;
    });
    const kinds = refs.map((r) => (r.kind === 'b2' ? 'B2' : 'dilute-gas viscosity')).join(' and ');
    const set = await createParameterSet(ctx, modeller, { fitId, rationale: `Fit #1 reproduces the ${kinds} data of ${demo.name} within their uncertainties; full-potential parameters for gas-phase work.` });
    await submitParameterSet(ctx, modeller, set.id);
    await reviewParameterSet(ctx, reviewer, set.id, 'approve', `Residuals are within the stated uncertainties across ${refs.length === 1 ? 'the data set' : 'both data sets'}; approved for the catalog.`);
    approved++;
  }
  return approved;
}

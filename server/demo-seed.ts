import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { DEMO_MIXTURES, DEMO_PEOPLE, DEMO_SUBSTANCES, demoFileOf, demoHasTable, type DemoKind } from '../fixtures/demo/scenario';
import type { AppContext } from './app-context';
import type { CurrentUser } from './common/auth-middleware';
import type { Db, Tx } from './db/database';
import { recordAudit } from './features/audit/audit.service';
import { hashPassword } from './features/auth/auth';
import { createFit } from './features/fits/fits.service';
import { listMeasurementSetsOfSubstance } from './features/measurement-sets/measurement-sets.repository';
import { parseUpload, storeVersion } from './features/measurement-sets/measurement-sets.service';
import { markNoticeRead, noticesOf } from './features/notices/notices.service';
import { createParameterSet, reviewParameterSet, submitParameterSet } from './features/parameter-sets/parameter-sets.service';
import { countPeople, findPersonByEmail, insertPerson, rolesOf } from './features/people/people.repository';
import { findSubstanceByName } from './features/substances/substances.repository';

const demoFile = (name: string) => readFileSync(new URL(`../fixtures/demo/${name}`, import.meta.url));

/**
 * The one place that seeds the invented demo scenario (fixtures/demo/scenario.ts) into an empty database, through
 * the features' own services: one person per role, the demo substances with their measurement tables (uploaded
 * through the same parser and store as any upload) and, with `withApprovedSets`, an approved parameter set per
 * substance from a real fit. Does nothing when any person exists, so it is safe to call at every start.
 */
export async function seedDemo(
  ctx: AppContext,
  options: { demoPassword: string; withApprovedSets?: boolean },
): Promise<{ seeded: boolean; approved: number }> {
  const { db } = ctx;
  if ((await countPeople(db)) > 0) return { seeded: false, approved: 0 };
  const passwordHash = await hashPassword(options.demoPassword);
  await db.transaction().execute(async (tx) => {
    for (const person of DEMO_PEOPLE) {
      const id = randomUUID();
      await insertPerson(tx, { id, email: person.email, name: person.name, passwordHash, roles: person.roles });
      await recordAudit(tx, {
        actor: null,
        action: 'user.created',
        targetType: 'user',
        targetId: id,
        summary: `Demo seed added ${person.email} with roles ${person.roles.join(', ')}`,
        after: { email: person.email, name: person.name, roles: person.roles },
      });
    }
    const modeller = (await demoPerson(tx, 'modeller'))!;
    const now = new Date().toISOString();
    for (const s of DEMO_SUBSTANCES) {
      const substance = await tx
        .insertInto('substance')
        .values({
          name: s.name,
          formula: s.formula ?? null,
          description: s.description,
          molarMassGramsPerMol: s.molarMassGPerMol,
          createdBy: modeller.id,
          createdAt: now,
          updatedAt: now,
        })
        .returning('id')
        .executeTakeFirstOrThrow();
      await recordAudit(tx, {
        actor: modeller,
        action: 'substance.created',
        targetType: 'substance',
        targetId: substance.id,
        summary: `Demo seed created substance ${s.name}`,
      });
      for (const kind of [
        'b2',
        'viscosity',
        'density',
        'saturatedLiquidDensity',
        'saturatedVapourDensity',
        'vapourPressure',
      ] as DemoKind[]) {
        const meta = s.sources[kind];
        if (!meta || !demoHasTable(s, kind)) continue;
        const name = demoFileOf(s.file, kind);
        const file = { originalname: name, buffer: demoFile(name) };
        const fields = { source: meta.source, method: meta.method };
        const parsed = parseUpload(file, kind, fields, s.molarMassGPerMol);
        await storeVersion(tx, {
          newMeasurementSet: { substanceId: substance.id, kind, name: meta.name },
          file,
          fields,
          parsed,
          actor: modeller,
        });
      }
    }
    // Cross second virial coefficients of a demo pair, stored with the pair's first substance.
    for (const m of DEMO_MIXTURES) {
      const first = await tx
        .selectFrom('substance')
        .select(['id', 'molarMassGramsPerMol'])
        .where('name', '=', m.substances[0])
        .executeTakeFirstOrThrow();
      const file = { originalname: `${m.file}.csv`, buffer: demoFile(`${m.file}.csv`) };
      const fields = {
        source: m.source,
        method: m.method,
        notes: `Cross second virial coefficient of the pair ${m.substances.join(' + ')}.`,
      };
      const parsed = parseUpload(file, 'b12', fields, first.molarMassGramsPerMol);
      await storeVersion(tx, {
        newMeasurementSet: { substanceId: first.id, kind: 'b12', name: m.name },
        file,
        fields,
        parsed,
        actor: modeller,
      });
    }
  });
  const approved = options.withApprovedSets ? await seedApprovedSets(ctx) : 0;
  return { seeded: true, approved };
}

async function demoPerson(db: Db | Tx, role: 'modeller' | 'reviewer'): Promise<CurrentUser | null> {
  const email = DEMO_PEOPLE.find((p) => p.roles.includes(role))?.email;
  const row = email ? await findPersonByEmail(db, email) : undefined;
  return row ? { id: row.id, email: row.email, name: row.name, roles: await rolesOf(db, row.id) } : null;
}

/**
 * Gives the demo catalog something to show: for each demo substance, the demo modeller fits its B2 and viscosity
 * tables exactly as the API does (createFit, the job runner, the fit's notice and mail), drafts a parameter set,
 * submits it, and the demo reviewer approves it, so the history, audit trail and mail are those of a real review.
 * Density tables need simulations and are left for the modeller to fit in the demo.
 */
export async function seedApprovedSets(ctx: AppContext): Promise<number> {
  const modeller = await demoPerson(ctx.db, 'modeller');
  const reviewer = await demoPerson(ctx.db, 'reviewer');
  if (!modeller || !reviewer) return 0;
  let approved = 0;
  for (const demo of DEMO_SUBSTANCES) {
    const substance = await findSubstanceByName(ctx.db, demo.name);
    if (!substance) continue;
    const gasPhase = (await listMeasurementSetsOfSubstance(ctx.db, substance.id)).filter(
      (s) => (s.kind === 'b2' || s.kind === 'viscosity') && !s.withdrawnAt,
    );
    if (!gasPhase.length) continue;
    const fit = await createFit(ctx, modeller, { substanceId: substance.id, measurementSets: gasPhase.map((s) => ({ id: s.id })) });
    const job = await ctx.jobs.waitFor(fit.jobId);
    const result = job.result as { status?: string } | null;
    if (job.status !== 'succeeded' || result?.status !== 'succeeded') continue;
    const kinds = gasPhase.map((s) => (s.kind === 'b2' ? 'B2' : 'dilute-gas viscosity')).join(' and ');
    const set = await createParameterSet(ctx.db, modeller, {
      fitId: fit.id,
      rationale: `Fit #${fit.number} reproduces the ${kinds} data of ${demo.name} within their uncertainties; full-potential parameters for gas-phase work.`,
    });
    await submitParameterSet(ctx.db, modeller, set.id);
    await reviewParameterSet(
      ctx.db,
      reviewer,
      set.id,
      'approve',
      `Residuals are within the stated uncertainties across ${gasPhase.length === 1 ? 'the data set' : 'both data sets'}; approved for the catalog.`,
    );
    approved++;
  }
  // The demo modeller has seen the seed's own fit notices; the bell starts quiet.
  for (const notice of (await noticesOf(ctx.db, modeller.id)).notices)
    if (!notice.readAt) await markNoticeRead(ctx.db, modeller.id, notice.id);
  return approved;
}

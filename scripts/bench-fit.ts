/**
 * `npm run -s bench:fit [-- --json] [--redis URL --worker-processes N]`: a joint fit of the demo's 8 densities on 2 isotherms plus its B2 table,
 * through the real job runner and worker pool, first from a cold simulation cache and then again (warm).
 * Prints wall times, rounds, new and reused runs, points predicted by reweighting and why the simulation stage stopped;
 * with --json one object { cold: { seconds, rounds, newRuns, reusedRuns, reweightedPoints, stoppedBy, epsilonK,
 * sigmaAngstrom }, warm: { …same… } }. A report, never a test.
 * Uses one worker per core unless WORKERS is set: the fit is the only work, the main thread mostly waits.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import os from 'node:os';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { createContext } from '../server/bootstrap';
import { loadEnv } from '../server/config/env';
import { seedDemo } from '../server/demo-seed';
import { createFit, findFit } from '../server/features/fits/fits.service';
import { rolesOf } from '../server/features/people/people.repository';

const { values } = parseArgs({ options: { json: { type: 'boolean' }, redis: { type: 'string' }, 'worker-processes': { type: 'string' } } });
if (values.redis) {
  // The Redis driver with 1 … N worker processes (scripts/bench-fit-workers.ts).
  const { benchWithWorkerProcesses } = await import('./bench-fit-workers');
  await benchWithWorkerProcesses(values.redis, Number(values['worker-processes'] ?? 2), !!values.json);
  process.exit(0);
}
const dir = mkdtempSync(path.join(tmpdir(), 'epsigma-bench-fit-'));
const env = loadEnv({
  WORKERS: String(os.availableParallelism()),
  ...process.env,
  NODE_ENV: 'production',
  DATABASE_PATH: path.join(dir, 'bench.sqlite'),
  LOG_REQUESTS: '0',
});
const ctx = await createContext(env, () => {});
try {
  await seedDemo(ctx, { demoPassword: 'bench-password' });
  const user = await ctx.db
    .selectFrom('user')
    .select(['id', 'email', 'name'])
    .where('email', '=', 'modeller@demo.epsigma.test')
    .executeTakeFirstOrThrow();
  const actor = { ...user, roles: await rolesOf(ctx.db, user.id) };
  const substance = await ctx.db.selectFrom('substance').select('id').where('name', '=', 'Quillgas QG-1').executeTakeFirstOrThrow();
  const measurementSets = await ctx.db
    .selectFrom('measurementSet')
    .select(['id', 'kind'])
    .where('substanceId', '=', substance.id)
    .where('kind', 'in', ['b2', 'density'])
    .execute();
  const densityPoints = await ctx.db
    .selectFrom('measurementRow')
    .innerJoin('measurementSetVersion', 'measurementSetVersion.id', 'measurementRow.measurementSetVersionId')
    .innerJoin('measurementSet', 'measurementSet.id', 'measurementSetVersion.measurementSetId')
    .select(['measurementRow.temperatureK'])
    .where('measurementSet.substanceId', '=', substance.id)
    .where('measurementSet.kind', '=', 'density')
    .execute();
  const countRuns = async () =>
    Number(
      (
        await ctx.db
          .selectFrom('job')
          .select((eb) => eb.fn.countAll<number>().as('n'))
          .where('kind', '=', 'simulation')
          .executeTakeFirstOrThrow()
      ).n,
    );

  const runOnce = async () => {
    const before = await countRuns();
    const started = performance.now();
    const { id, jobId } = await createFit(ctx, actor, {
      substanceId: substance.id,
      measurementSets: measurementSets.map((d) => ({ id: d.id })),
    });
    const job = await ctx.jobs.waitFor(jobId);
    const seconds = (performance.now() - started) / 1000;
    const fit = await findFit(ctx.db, id);
    const result = JSON.parse(fit!.resultJson ?? '{}');
    return {
      status: job.status,
      seconds: Number(seconds.toFixed(2)),
      rounds: result.mdRounds ?? null,
      newRuns: (await countRuns()) - before,
      reusedRuns: result.reusedRuns ?? null,
      reweightedPoints: result.reweightedPoints ?? null,
      stoppedBy: result.stoppedBy ?? null,
      epsilonK: result.epsilonK ?? null,
      sigmaAngstrom: result.sigmaAngstrom ?? null,
      stdErr: result.stdErr ?? null,
      error: job.error,
    };
  };

  const cold = await runOnce();
  const warm = await runOnce();
  const pick = (r: typeof cold) => ({
    seconds: r.seconds,
    rounds: r.rounds,
    newRuns: r.newRuns,
    reusedRuns: r.reusedRuns,
    reweightedPoints: r.reweightedPoints,
    stoppedBy: r.stoppedBy,
    epsilonK: r.epsilonK,
    sigmaAngstrom: r.sigmaAngstrom,
  });
  if (values.json) console.log(JSON.stringify({ cold: pick(cold), warm: pick(warm) }, null, 2));
  else {
    const lastFit = (
      await ctx.db
        .selectFrom('fit')
        .select((eb) => eb.fn.max('id').as('m'))
        .executeTakeFirstOrThrow()
    ).m as number;
    const mdSettings = JSON.parse((await findFit(ctx.db, lastFit))!.optionsJson).density;
    const fixture = `Quillgas QG-1 demo: ${densityPoints.length} densities on ${new Set(densityPoints.map((p) => p.temperatureK)).size} isotherms + B2 table`;
    console.log(`${fixture}, ${env.WORKERS} worker(s), MD ${JSON.stringify(mdSettings)}`);
    for (const [name, r] of [
      ['cold', cold],
      ['warm', warm],
    ] as const) {
      const se = r.stdErr ?? {};
      console.log(
        `${name}: ${r.status} in ${r.seconds} s, ${r.rounds} round(s), ${r.newRuns} new run(s), ${r.reusedRuns} reused, ${r.reweightedPoints} reweighted point(s), stopped by ${r.stoppedBy}; ` +
          `ε/k_B = ${r.epsilonK?.toFixed(2)} ± ${se.epsilonK?.toFixed(2)} K, σ = ${r.sigmaAngstrom?.toFixed(4)} ± ${se.sigmaAngstrom?.toFixed(4)} Å${r.error ? ` (${r.error})` : ''}`,
      );
    }
  }
} finally {
  await ctx.close();
  rmSync(dir, { recursive: true, force: true });
}

/**
 * What the Mie collision integrals cost, on the fly against the precomputed table (a report, never a test):
 *
 *   node --import tsx scripts/bench-mie-collision.ts [--repulsive-exponent 16] [--column] [--json]
 *
 * - exact: one Ω(1,1)*, Ω(2,2)* point from the definition (mieCollisionIntegralsExact, adaptive thermal average) at several T*;
 * - column (--column, minutes): all 52 T* nodes of one λr from one set of cross-sections (mieCollisionIntegralsOnGrid),
 *   what building a table column on the fly for a new λr would cost;
 * - lookup: one interpolated value (mieCollisionIntegrals), averaged over 200 000 calls;
 * - fit: a held-λr Mie fit of B2 + viscosity and a fit with λr profiled over 8–36, with the table, and how many Ω(2,2)*
 *   evaluations each made (what on-the-fly evaluation would have had to pay for).
 */
import { parseArgs } from 'node:util';
import { COLLISION_TABLE } from '../shared/physics/collision-table.generated';
import { mieCollisionIntegrals, mieCollisionIntegralsExact, mieCollisionIntegralsOnGrid } from '../shared/physics/mie-collision-integrals';
import { b2WithGradient } from '../shared/physics/virial';
import { viscosityWithGradient } from '../shared/physics/viscosity';
import { fitLennardJones, type FitMeasurementSet } from '../shared/fitting/lj-fit';
import { fitMieWithExponent } from '../shared/fitting/mie-fit';
import { PROPERTY_MODELS } from '../shared/fitting/property-models';

const { values } = parseArgs({
  options: { 'repulsive-exponent': { type: 'string', default: '16' }, column: { type: 'boolean' }, json: { type: 'boolean' } },
  strict: true,
});
const n = Number(values['repulsive-exponent']);
const seconds = (t0: number) => (performance.now() - t0) / 1000;
const report: Record<string, unknown> = {
  repulsiveExponent: n,
  date: new Date().toISOString(),
  loadAverage: (await import('node:os')).loadavg().map((x) => Number(x.toFixed(2))),
};

const exact: Array<{ reducedTemperature: number; seconds: number }> = [];
for (const t of [0.3, 1, 5, 50]) {
  const t0 = performance.now();
  mieCollisionIntegralsExact(t, n);
  exact.push({ reducedTemperature: t, seconds: Number(seconds(t0).toFixed(2)) });
}
report.exactPerPoint = exact;

if (values.column) {
  const tStars = COLLISION_TABLE.rows.filter((_, i) => i % 3 === 0).map((r) => Math.exp(r[0]));
  const t0 = performance.now();
  const grid = mieCollisionIntegralsOnGrid(tStars, n);
  report.columnOnTheFly = { nodes: tStars.length, crossSections: grid.crossSectionEvaluations, seconds: Number(seconds(t0).toFixed(1)) };
}

let sink = 0;
const calls = 200_000;
let t0 = performance.now();
for (let i = 0; i < calls; i++) sink += mieCollisionIntegrals(0.5 + (i % 1000) * 0.01, n + (i % 7) * 0.1).omega22;
report.lookupMicroseconds = Number(((seconds(t0) * 1e6) / calls).toFixed(2));

// Synthetic Mie data (no noise): 11 B2 and 11 viscosity points of an invented gas, ε/k_B = 150 K, σ = 3.7 Å, M = 58.1 g/mol.
const temps = [120, 150, 190, 240, 300, 380, 480, 600, 760, 950, 1200];
const b2: FitMeasurementSet = {
  id: 'b2',
  kind: 'b2',
  rows: temps.map((T) => ({
    temperatureK: T,
    value: b2WithGradient(T, 150, 3.7, undefined, { repulsiveExponent: n }).b2Cm3PerMol,
    uncertainty: 0.3,
  })),
};
const eta: FitMeasurementSet = {
  id: 'eta',
  kind: 'viscosity',
  rows: temps.map((T) => {
    const v = viscosityWithGradient(T, 150, 3.7, 58.1, { repulsiveExponent: n }).viscosityMicroPaS;
    return { temperatureK: T, value: v, uncertainty: 0.003 * v };
  }),
};
// Count viscosity evaluations by wrapping the model (restored afterwards).
const model = PROPERTY_MODELS.viscosity;
const evaluate = model.evaluate;
let evaluations = 0;
model.evaluate = (...args: Parameters<typeof evaluate>) => {
  evaluations++;
  return evaluate(...args);
};
t0 = performance.now();
fitLennardJones([b2, eta], { molarMassGPerMol: 58.1, repulsiveExponent: n, restarts: 0, profiles: false });
report.heldFit = { seconds: Number(seconds(t0).toFixed(2)), viscosityEvaluations: evaluations };
evaluations = 0;
t0 = performance.now();
const profiled = fitMieWithExponent([b2, eta], { molarMassGPerMol: 58.1, restarts: 0 });
report.profiledFit = {
  seconds: Number(seconds(t0).toFixed(2)),
  viscosityEvaluations: evaluations,
  lambdaValues: profiled.repulsiveExponentProfile.values.length,
  best: Number(profiled.repulsiveExponentProfile.best.toFixed(3)),
};
model.evaluate = evaluate;
report.sink = Number.isFinite(sink);

process.stdout.write(
  values.json
    ? `${JSON.stringify(report, null, 2)}\n`
    : `${Object.entries(report)
        .map(([k, v]) => `${k}: ${JSON.stringify(v)}`)
        .join('\n')}\n`,
);

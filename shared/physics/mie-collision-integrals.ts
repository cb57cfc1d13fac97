/**
 * Reduced transport collision integrals Ω^(1,1)* and Ω^(2,2)* of the Mie λr-6 potential
 * u*(r) = C(λr) (r^−λr − r^−6) (mie-potential.ts), by the same classical method as the LJ 12-6 code in
 * collision-integrals.ts (Hirschfelder, Curtiss & Bird 1954, §8.2): deflection angle χ(b, E) → transport
 * cross-sections Q^(l)*(E) → thermal averages Ω^(l,s)*(T*), reduced so that Ω* = 1 for rigid spheres of diameter σ.
 *
 * What changes with λr (λr = 12 gives the 12-6 formulas; exponents need not be integers):
 * - factorisation of F = 1 − b²/r² − u*(r)/E with y = r_m/r: F = (1 − y) H(y), H = β²(1 + y) + (C/E)(r_m^−λr S_λr(y) − r_m^−6 S_6(y)),
 *   S_n(y) = (1 − y^n)/(1 − y), evaluated as −expm1(n ln y)/(1 − y) so that it stays accurate as y → 1;
 * - orbiting: with w = r^−6 the barrier top of u* + E b²/r² sits at E when E = C[2w − (λr/2 − 1) w^(λr/6)] on the outer branch
 *   w < w*, w*^((λr−6)/6) = 24/(λr(λr − 2)); orbiting exists below E_o = C w* (2 − 12/λr) (0.8 for λr = 12), and
 *   b_o² = r_o² C (6w − λr w^(λr/6))/(2E).
 *
 * Values used by viscosity.ts come from mie-collision-table.generated.ts (scripts/generate-mie-collision-table.ts):
 * Ω* at 15 values of λr from 8 to 36 (14 computed by mieCollisionIntegralsOnGrid, λr = 12 copied from the 12-6 table) and
 * 52 temperatures (ln T* step ≈ 0.149 over 0.2–400), interpolated by cubic Hermite in ln T* (exact node derivatives) and
 * by 4-point Lagrange in 1/λr. λr = 12 is answered by the 12-6 table itself, so the LJ 12-6 numbers are those of
 * collision-integrals.ts to the last digit. Why a table and not on the fly: one exact evaluation costs seconds and one
 * λr column minutes (README, Mie λr-6, measured), while a fit evaluates Ω* thousands of times.
 */
import { brentRoot, omega11, omega11Derivative, omega22WithDerivatives, type CollisionIntegralPoint } from './collision-integrals';
import { LJ_REPULSIVE_EXPONENT, miePrefactor, requireRepulsiveExponent } from './mie-potential';
import { GAUSS10_WEIGHTS, KRONROD21_NODES, KRONROD21_WEIGHTS, integrateVector, type QuadratureOptions } from './quadrature';
import { MIE_COLLISION_TABLE } from './mie-collision-table.generated';

/** Quadrature tolerances of the three nested integrals (defaults: those of the 12-6 code). */
export interface MieCollisionAccuracy {
  deflection: QuadratureOptions;
  crossSection: QuadratureOptions;
  thermal: QuadratureOptions;
}

export const MIE_COLLISION_ACCURACY_DEFAULT: MieCollisionAccuracy = {
  deflection: { relativeTolerance: 1e-10, absoluteTolerance: 1e-11, maxSubintervals: 100 },
  crossSection: { relativeTolerance: 1e-8, absoluteTolerance: 1e-12, maxSubintervals: 400 },
  thermal: { relativeTolerance: 1e-7, absoluteTolerance: 1e-14, maxSubintervals: 200 },
};

/** Looser tolerances used to build the table: about 1e-6 relative on Ω*, well inside the interpolation error. */
export const MIE_COLLISION_ACCURACY_TABLE: MieCollisionAccuracy = {
  deflection: { relativeTolerance: 1e-9, absoluteTolerance: 1e-10, maxSubintervals: 100 },
  crossSection: { relativeTolerance: 1e-7, absoluteTolerance: 1e-11, maxSubintervals: 400 },
  thermal: { relativeTolerance: 1e-6, absoluteTolerance: 1e-13, maxSubintervals: 200 },
};

/** e^{−x} x^4 is below 1e−15 of its integral beyond x = 50. */
const THERMAL_UPPER_LIMIT = 50;

/** The potential's constants for one λr. */
interface MieShape {
  n: number;
  c: number;
  /** w* = r*^−6 at the top of the orbiting curve E(w), and E_o = E(w*). */
  wStar: number;
  orbitingEnergy: number;
}

function shapeOf(repulsiveExponent: number): MieShape {
  requireRepulsiveExponent(repulsiveExponent);
  const n = repulsiveExponent;
  const c = miePrefactor(n);
  const wStar = Math.pow(24 / (n * (n - 2)), 6 / (n - 6));
  return { n, c, wStar, orbitingEnergy: c * wStar * (2 - 12 / n) };
}

/** Reduced energy below which an orbiting impact parameter exists (0.8 for λr = 12). */
export function mieOrbitingEnergy(repulsiveExponent: number): number {
  return shapeOf(repulsiveExponent).orbitingEnergy;
}

const potential = (r: number, m: MieShape) => m.c * (Math.pow(r, -m.n) - Math.pow(r, -6));

/** (1 − y^n)/(1 − y) with s² = 1 − y, accurate for y → 1 (= n at y = 1). */
function seriesSum(n: number, s: number): number {
  const s2 = s * s;
  if (s2 === 0) return n;
  return -Math.expm1(n * Math.log1p(-s2)) / s2;
}

export interface MieOrbitingParameters {
  orbitRadius: number;
  orbitImpactParameter: number;
}

/** Orbiting radius and impact parameter at E below E_o (see file header), else null. */
export function mieOrbitingParameters(reducedEnergy: number, repulsiveExponent: number): MieOrbitingParameters | null {
  return orbitOf(reducedEnergy, shapeOf(repulsiveExponent));
}

function orbitOf(E: number, m: MieShape): MieOrbitingParameters | null {
  if (!(E > 0) || E >= m.orbitingEnergy) return null;
  const energyAt = (w: number) => m.c * (2 * w - (m.n / 2 - 1) * Math.pow(w, m.n / 6)) - E;
  const w = brentRoot(energyAt, 0, m.wStar, -E, m.orbitingEnergy - E);
  const r = Math.pow(w, -1 / 6);
  const b2 = (r * r * m.c * (6 * w - m.n * Math.pow(w, m.n / 6))) / (2 * E);
  return { orbitRadius: r, orbitImpactParameter: Math.sqrt(b2) };
}

function closestApproachOf(b: number, E: number, m: MieShape, orbit: MieOrbitingParameters | null): number {
  const F = (r: number) => 1 - (b * b) / (r * r) - potential(r, m) / E;
  // Inner bracket: inside r = (C/E)^(1/λr) the repulsion alone nearly exceeds E; the loop below moves it inwards if needed.
  let lo = Math.min(1, Math.pow(m.c / E, 1 / m.n));
  let hi = Math.max(b, 1);
  if (orbit) {
    if (b > orbit.orbitImpactParameter) lo = orbit.orbitRadius;
    else if (b < orbit.orbitImpactParameter) hi = orbit.orbitRadius;
  }
  let fLo = F(lo);
  let fHi = F(hi);
  if (fHi === 0) return hi;
  if (fLo === 0) return lo;
  while (fLo > 0) {
    lo *= 0.9;
    fLo = F(lo);
  }
  while (fHi < 0) {
    hi *= 1.1;
    fHi = F(hi);
  }
  return brentRoot(F, lo, hi, fLo, fHi);
}

/** Distance of closest approach r_m (in σ) for the Mie λr-6 potential. */
export function mieClosestApproach(impactParameter: number, reducedEnergy: number, repulsiveExponent: number): number {
  const m = shapeOf(repulsiveExponent);
  return closestApproachOf(impactParameter, reducedEnergy, m, orbitOf(reducedEnergy, m));
}

function deflectionOf(b: number, E: number, m: MieShape, orbit: MieOrbitingParameters | null, quad: QuadratureOptions): number {
  if (b === 0) return Math.PI;
  const rm = closestApproachOf(b, E, m, orbit);
  const beta = b / rm;
  const beta2 = beta * beta;
  const pn = Math.pow(rm, -m.n);
  const p6 = Math.pow(rm, -6);
  const scale = m.c / E;
  const hOf = (s: number): { h: number; h0: number; d: number } => {
    const y = 1 - s * s;
    const h0 = beta2 * (1 + y);
    const d = scale * (pn * seriesSum(m.n, s) - p6 * seriesSum(6, s));
    return { h: h0 + d, h0, d };
  };
  const integrand = (s: number): number[] => {
    const { h, h0, d } = hOf(s);
    const sh = Math.sqrt(Math.max(h, 0));
    const sh0 = Math.sqrt(h0);
    return [sh > 0 ? d / (sh * sh0 * (sh + sh0)) : 0];
  };
  // Geometric breakpoints around a near-zero of H (orbiting), as in collision-integrals.ts.
  const breaks: number[] = [];
  const addGeometric = (centre: number, hMin: number, curvature: number) => {
    if (!(hMin < 0.05) || !(curvature > 0)) return;
    let w = Math.sqrt(Math.max(hMin, 1e-32) / curvature);
    if (centre > 0 && centre < 1) breaks.push(centre);
    while (w < 1) {
      if (centre - w > 0) breaks.push(centre - w);
      if (centre + w < 1) breaks.push(centre + w);
      w *= 4;
    }
  };
  const h1 = hOf(0).h;
  if (h1 < 0.05) addGeometric(0, h1, (hOf(1e-2).h - h1) / 1e-4);
  if (orbit && b < orbit.orbitImpactParameter) {
    // Barrier top for this b: r³u′(r)/2 = E b², i.e. (C/2)(6 w^{2/3} − λr w^{(λr−2)/6}) = E b² on the outer branch w ≤ w*.
    const g = (w: number) => 0.5 * m.c * (6 * Math.pow(w, 2 / 3) - m.n * Math.pow(w, (m.n - 2) / 6)) - E * b * b;
    const gHi = g(m.wStar);
    if (gHi > 0) {
      const wTop = brentRoot(g, 1e-300, m.wStar, -E * b * b, gHi);
      const yTop = rm * Math.pow(wTop, 1 / 6);
      if (yTop < 1) {
        const sTop = Math.sqrt(1 - yTop);
        const hTop = hOf(sTop).h;
        const step = 1e-3 * Math.min(sTop, 1 - sTop);
        const curvature = (hOf(sTop + step).h - 2 * hTop + hOf(sTop - step).h) / (2 * step * step);
        addGeometric(sTop, hTop, curvature);
      }
    }
  }
  return 4 * beta * integrateVector(integrand, 0, 1, 1, quad, breaks).values[0];
}

/** Classical deflection angle χ(b, E) in radians for the Mie λr-6 potential (b in σ, E in ε). */
export function mieDeflectionAngle(
  impactParameter: number,
  reducedEnergy: number,
  repulsiveExponent: number,
  accuracy = MIE_COLLISION_ACCURACY_DEFAULT,
): number {
  const m = shapeOf(repulsiveExponent);
  return deflectionOf(impactParameter, reducedEnergy, m, orbitOf(reducedEnergy, m), accuracy.deflection);
}

function crossSectionsOf(E: number, m: MieShape, accuracy: MieCollisionAccuracy): { q1: number; q2: number } {
  const orbit = orbitOf(E, m);
  const quad = accuracy.crossSection;
  const integrand = (b: number): number[] => {
    const chi = deflectionOf(b, E, m, orbit, accuracy.deflection);
    const sinHalf = Math.sin(0.5 * chi);
    const sinChi = Math.sin(chi);
    return [4 * sinHalf * sinHalf * b, 3 * sinChi * sinChi * b];
  };
  const bOrbit = orbit ? orbit.orbitImpactParameter : 0;
  const bSplit = Math.max(2.5, 1.5 * bOrbit);
  const tail = integrateVector(
    (t) => {
      const v = integrand(bSplit / t);
      const jac = bSplit / (t * t);
      return [v[0] * jac, v[1] * jac];
    },
    0,
    1,
    2,
    quad,
  );
  const sum = [tail.values[0], tail.values[1]];
  const add = (v: number[]) => {
    sum[0] += v[0];
    sum[1] += v[1];
  };
  if (!orbit) {
    add(integrateVector(integrand, 0, bSplit, 2, quad).values);
  } else {
    // Logarithmic variable around b_o and the mean of cos χ inside |b − b_o| < 1e-9 b_o, as in collision-integrals.ts.
    const delta = 0.2 * bOrbit;
    const gap = 1e-9 * bOrbit;
    add([2 * bOrbit * 2 * gap, 1.5 * bOrbit * 2 * gap]);
    const tauLo = Math.log(gap);
    const tauHi = Math.log(delta);
    for (const side of [-1, 1]) {
      add(
        integrateVector(
          (tau) => {
            const e = Math.exp(tau);
            const v = integrand(bOrbit + side * e);
            return [v[0] * e, v[1] * e];
          },
          tauLo,
          tauHi,
          2,
          quad,
        ).values,
      );
    }
    add(integrateVector(integrand, 0, bOrbit - delta, 2, quad).values);
    add(integrateVector(integrand, bOrbit + delta, bSplit, 2, quad).values);
  }
  return { q1: sum[0], q2: sum[1] };
}

/** Reduced transport cross-sections Q^(1)*, Q^(2)* (1 for rigid spheres) at E* for the Mie λr-6 potential. */
export function mieTransportCrossSections(
  reducedEnergy: number,
  repulsiveExponent: number,
  accuracy = MIE_COLLISION_ACCURACY_DEFAULT,
): { q1: number; q2: number } {
  if (!(reducedEnergy > 0) || !Number.isFinite(reducedEnergy)) {
    throw new RangeError(`reducedEnergy must be a finite number > 0 (got ${String(reducedEnergy)})`);
  }
  return crossSectionsOf(reducedEnergy, shapeOf(repulsiveExponent), accuracy);
}

/**
 * Ω^(1,1)*, Ω^(2,2)* and their T*-derivatives of the Mie λr-6 potential from the definition (seconds per call);
 * the thermal average is split at the orbiting threshold x = E_o/T*, as in collisionIntegralsExact.
 */
export function mieCollisionIntegralsExact(
  tStar: number,
  repulsiveExponent: number,
  accuracy = MIE_COLLISION_ACCURACY_DEFAULT,
): CollisionIntegralPoint {
  if (typeof tStar !== 'number' || !Number.isFinite(tStar) || tStar <= 0) {
    throw new RangeError(`reduced temperature tStar must be a finite number > 0 (got ${String(tStar)})`);
  }
  const m = shapeOf(repulsiveExponent);
  const integrand = (x: number): number[] => {
    const { q1, q2 } = crossSectionsOf(x * tStar, m, accuracy);
    const ex = Math.exp(-x);
    const x2 = x * x;
    return [ex * x2 * q1, ex * x2 * x * q1, ex * x2 * x * q2, ex * x2 * x2 * q2];
  };
  const threshold = m.orbitingEnergy / tStar;
  const r = integrateVector(integrand, 0, THERMAL_UPPER_LIMIT, 4, accuracy.thermal, threshold < THERMAL_UPPER_LIMIT ? [threshold] : []);
  const [m2q1, m3q1, m3q2, m4q2] = r.values;
  const omega11 = m2q1 / 2;
  const omega22 = m3q2 / 6;
  return { omega11, omega22, dOmega11dT: (m3q1 / 2 - 3 * omega11) / tStar, dOmega22dT: (m4q2 / 6 - 4 * omega22) / tStar };
}

/** Span of the Mie table (that of the 12-6 table); the interpolated functions throw a RangeError outside it. */
export const MIE_COLLISION_TABLE_RANGE: { minReducedTemperature: number; maxReducedTemperature: number } = {
  minReducedTemperature: MIE_COLLISION_TABLE.minReducedTemperature,
  maxReducedTemperature: MIE_COLLISION_TABLE.maxReducedTemperature,
};

export interface MieCollisionValues {
  omega11: number;
  omega22: number;
  /** dΩ^(1,1)*∕dT* */
  dOmega11dT: number;
  /** dΩ^(2,2)*∕dT* */
  dOmega22dT: number;
  /** d²Ω^(2,2)*∕dT*² (for Kihara's factor) */
  d2Omega22dT2: number;
}

/** Cubic Hermite in u = ln T* on one λr column: [Ω11, Ω22, dΩ11/du, dΩ22/du, d²Ω22/du²]. */
function hermiteColumn(rows: readonly (readonly number[])[], u: number): number[] {
  const { lnMin, lnStep } = MIE_COLLISION_TABLE;
  let i = Math.floor((u - lnMin) / lnStep);
  if (i < 0) i = 0;
  if (i > rows.length - 2) i = rows.length - 2;
  const a = rows[i];
  const b = rows[i + 1];
  const h = lnStep;
  const t = (u - (lnMin + i * lnStep)) / h;
  const t2 = t * t;
  const t3 = t2 * t;
  const out: number[] = [];
  for (const [v, s] of [
    [0, 2],
    [1, 3],
  ]) {
    out.push((2 * t3 - 3 * t2 + 1) * a[v] + (t3 - 2 * t2 + t) * h * a[s] + (-2 * t3 + 3 * t2) * b[v] + (t3 - t2) * h * b[s]);
  }
  for (const [v, s] of [
    [0, 2],
    [1, 3],
  ]) {
    out.push(((6 * t2 - 6 * t) * (a[v] - b[v])) / h + (3 * t2 - 4 * t + 1) * a[s] + (3 * t2 - 2 * t) * b[s]);
  }
  out.push(((12 * t - 6) * (a[1] - b[1])) / (h * h) + ((6 * t - 4) * a[3] + (6 * t - 2) * b[3]) / h);
  return out;
}

/**
 * Ω^(1,1)*, Ω^(2,2)* and T*-derivatives of the Mie λr-6 potential (microseconds). λr = 12 returns the 12-6 table's
 * values (collision-integrals.ts) unchanged; other λr interpolate the Mie table: cubic Hermite in ln T* on the four
 * λr columns nearest λr, then 4-point Lagrange interpolation in 1/λr (Ω* approaches its λr → ∞ limit smoothly in 1/λr).
 */
export function mieCollisionIntegrals(tStar: number, repulsiveExponent: number): MieCollisionValues {
  requireRepulsiveExponent(repulsiveExponent);
  if (typeof tStar !== 'number' || !Number.isFinite(tStar))
    throw new RangeError(`reduced temperature tStar must be a finite number (got ${String(tStar)})`);
  const { minReducedTemperature: lo, maxReducedTemperature: hi } = MIE_COLLISION_TABLE_RANGE;
  if (tStar < lo || tStar > hi)
    throw new RangeError(`reduced temperature tStar = ${tStar} is outside the collision-integral table range [${lo}, ${hi}]`);
  if (repulsiveExponent === LJ_REPULSIVE_EXPONENT) {
    const o22 = omega22WithDerivatives(tStar);
    return {
      omega11: omega11(tStar),
      dOmega11dT: omega11Derivative(tStar),
      omega22: o22.omega22,
      dOmega22dT: o22.dOmega22dT,
      d2Omega22dT2: o22.d2Omega22dT2,
    };
  }
  const grid = MIE_COLLISION_TABLE.repulsiveExponents;
  let k = 0;
  while (k < grid.length - 2 && grid[k + 1] <= repulsiveExponent) k++;
  const first = Math.min(Math.max(k - 1, 0), grid.length - 4);
  const x = 1 / repulsiveExponent;
  const xs = [0, 1, 2, 3].map((j) => 1 / grid[first + j]);
  const u = Math.log(tStar);
  const sum = [0, 0, 0, 0, 0];
  for (let j = 0; j < 4; j++) {
    let weight = 1;
    for (let m = 0; m < 4; m++) if (m !== j) weight *= (x - xs[m]) / (xs[j] - xs[m]);
    if (weight === 0) continue;
    const col = hermiteColumn(MIE_COLLISION_TABLE.rows[first + j], u);
    for (let c = 0; c < 5; c++) sum[c] += weight * col[c];
  }
  const [o11, o22, d11du, d22du, d2u] = sum;
  return {
    omega11: o11,
    omega22: o22,
    dOmega11dT: d11du / tStar,
    dOmega22dT: d22du / tStar,
    d2Omega22dT2: (d2u - d22du) / (tStar * tStar),
  };
}

/**
 * Ω^(1,1)*, Ω^(2,2)* and T*-derivatives at many T* at once for one λr: the same definition as mieCollisionIntegralsExact,
 * with the thermal average taken on one fixed grid in v = ln E shared by all T* (Q^(l)*(E) does not depend on T*):
 * Ω^(l,s)* = (1/(s+1)!) ∫ e^{−x} x^{s+2} Q^(l)*(E) dv, x = E/T*, by 21-point Kronrod panels of width ≤ panelWidth in v from
 * E = 1e-4 to 2.5e4, with panel edges graded geometrically towards the orbiting energy E_o, where Q(E) is not smooth.
 * Below E = 1e-4 (x < 5e-4 at T* = 0.2) the integrand, ∝ x^{s+2} E^{−1/3}, holds less than 1e-9 of Ω*; there, at
 * E ~ 1e-6, one cross-section costs minutes (orbits at b ~ 10σ).
 * Also returns the largest |K21 − G10| difference relative to the value, an estimate of the quadrature error.
 */
export function mieCollisionIntegralsOnGrid(
  tStars: readonly number[],
  repulsiveExponent: number,
  options: { accuracy?: MieCollisionAccuracy; panelWidth?: number; onProgress?: (done: number, total: number) => void } = {},
): { points: CollisionIntegralPoint[]; crossSectionEvaluations: number; relativeErrorEstimate: number } {
  const m = shapeOf(repulsiveExponent);
  const accuracy = options.accuracy ?? MIE_COLLISION_ACCURACY_TABLE;
  const width = options.panelWidth ?? 1;
  const vMin = Math.log(1e-4);
  const vMax = Math.log(2.5e4);
  const vO = Math.log(m.orbitingEnergy);
  const edges = new Set<number>([vMin, vMax, vO]);
  for (let v = vMin; v < vMax; v += width) edges.add(v);
  for (let d = 1e-5; d < width; d *= 4) {
    edges.add(vO - d);
    edges.add(vO + d);
  }
  const sorted = [...edges].sort((a, b) => a - b);
  const panels: Array<[number, number]> = [];
  for (let i = 0; i + 1 < sorted.length; i++) {
    // Split a panel left wider than `width` by the grading.
    const [a, b] = [sorted[i], sorted[i + 1]];
    const pieces = Math.max(1, Math.ceil((b - a) / width - 1e-9));
    for (let k = 0; k < pieces; k++) panels.push([a + ((b - a) * k) / pieces, a + ((b - a) * (k + 1)) / pieces]);
  }
  // Nodes: all 21 Kronrod abscissae per panel; weights for K21 and for the embedded G10.
  const nodes: Array<{ v: number; wK: number; wG: number }> = [];
  for (const [a, b] of panels) {
    const c = 0.5 * (a + b);
    const h = 0.5 * (b - a);
    KRONROD21_NODES.forEach((x, i) => {
      const wK = KRONROD21_WEIGHTS[i] * h;
      const wG = i % 2 === 1 ? GAUSS10_WEIGHTS[(i - 1) / 2] * h : 0;
      nodes.push({ v: c - h * x, wK, wG });
      if (x !== 0) nodes.push({ v: c + h * x, wK, wG });
    });
  }
  const q = nodes.map((node, i) => {
    options.onProgress?.(i, nodes.length);
    return crossSectionsOf(Math.exp(node.v), m, accuracy);
  });
  let worst = 0;
  const points = tStars.map((tStar) => {
    const sumK = [0, 0, 0, 0];
    const sumG = [0, 0, 0, 0];
    nodes.forEach((node, i) => {
      const x = Math.exp(node.v) / tStar;
      if (x > 60) return;
      const ex = Math.exp(-x);
      const x3 = x * x * x;
      const terms = [ex * x3 * q[i].q1, ex * x3 * x * q[i].q1, ex * x3 * x * q[i].q2, ex * x3 * x * x * q[i].q2];
      for (let k = 0; k < 4; k++) {
        sumK[k] += node.wK * terms[k];
        sumG[k] += node.wG * terms[k];
      }
    });
    for (let k = 0; k < 4; k++) worst = Math.max(worst, Math.abs(sumK[k] - sumG[k]) / Math.abs(sumK[k]));
    const [m2q1, m3q1, m3q2, m4q2] = sumK;
    const omega11 = m2q1 / 2;
    const omega22 = m3q2 / 6;
    return { omega11, omega22, dOmega11dT: (m3q1 / 2 - 3 * omega11) / tStar, dOmega22dT: (m4q2 / 6 - 4 * omega22) / tStar };
  });
  return { points, crossSectionEvaluations: nodes.length, relativeErrorEstimate: worst };
}

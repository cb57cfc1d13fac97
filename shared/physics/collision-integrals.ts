/**
 * Reduced transport collision integrals Ω^(1,1)* and Ω^(2,2)* of the Lennard-Jones 12-6 potential,
 * computed from the classical definitions (Hirschfelder, Curtiss & Bird 1954, §8.2; Chapman & Cowling 1970):
 *   χ(b, E)  = π − 2b ∫_{r_m}^∞ dr / (r² √(1 − b²/r² − u(r)/E))            (deflection angle)
 *   Q^(l)(E) = 2π ∫_0^∞ (1 − cos^l χ) b db                                   (transport cross-sections)
 *   Ω^(l,s)* = 1/((s+1)! T*^{s+2}) ∫_0^∞ e^{−E/T*} E^{s+1} Q^(l)*(E) dE         (thermal average)
 * with everything in reduced units (r, b in σ; E, u in ε) and Q^(l)* = Q^(l)/(πσ²[1 − (1+(−1)^l)/(2(1+l))]),
 * so that Ω* = 1 for rigid spheres of diameter σ.
 *
 * Numerics: r_m is the outermost root of 1 − b²/r² − u/E (Brent's method). With y = r_m/r and
 * y = 1 − s², the integrand 1/√F becomes 2/√H(y) where F = (1 − y) H(y) is factored exactly, so the
 * inverse-square-root end point singularity disappears; subtracting the force-free integral (which equals π/4)
 * analytically gives χ without the cancellation π − π at large b. For E* < 0.8 the effective potential
 * has a barrier and orbiting occurs at the impact parameter b_o (found in closed form); χ has a logarithmic
 * singularity there, which is made a breakpoint of the b integration. The same approach (substitution
 * plus adaptive quadrature to a prescribed accuracy) is that of O'Hara & Smith, J. Comput. Phys. 5, 328 (1970).
 *
 * The exact routines take about 1 s (T* > 10) to 10 s (T* < 1), relative accuracy about 1e-6; omega11/omega22/omega22Derivative interpolate the table
 * precomputed by scripts/generate-collision-table.ts (cubic Hermite in ln T* with the exact node derivatives).
 */
import { integrateVector, type QuadratureOptions } from './quadrature';
import { COLLISION_TABLE } from './collision-table.generated';

/** Reduced energy below which an orbiting impact parameter exists: max over w of 8w − 20w² (w = r^−6). */
export const ORBITING_REDUCED_ENERGY = 0.8;

// Within ~1e-8 of the orbiting impact parameter H is only known to rounding noise; the subdivision cap bounds the work there.
const CHI_QUAD: QuadratureOptions = { relativeTolerance: 1e-10, absoluteTolerance: 1e-11, maxSubintervals: 100 };
const CROSS_SECTION_QUAD: QuadratureOptions = { relativeTolerance: 1e-8, absoluteTolerance: 1e-12, maxSubintervals: 400 };
const THERMAL_QUAD: QuadratureOptions = { relativeTolerance: 1e-7, absoluteTolerance: 1e-14, maxSubintervals: 200 };
/** e^{−x} x^4 is below 1e−15 of its integral beyond x = 50. */
const THERMAL_UPPER_LIMIT = 50;

/** Reduced LJ potential u* = 4(r^−12 − r^−6). */
function potential(r: number): number {
  const w = Math.pow(r, -6);
  return 4 * w * (w - 1);
}

/** Brent's root finder (Brent 1973, "Algorithms for Minimization without Derivatives", ch. 4) on a sign-changing bracket. */
export function brentRoot(f: (x: number) => number, a0: number, b0: number, fa0: number, fb0: number): number {
  let a = a0;
  let b = b0;
  let fa = fa0;
  let fb = fb0;
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let iter = 0; iter < 200; iter++) {
    if (fb * fc > 0) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol = 2 * Number.EPSILON * Math.abs(b) + 1e-300;
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol || fb === 0) return b;
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      let p: number;
      let q: number;
      const s = fb / fa;
      if (a === c) {
        p = 2 * m * s;
        q = 1 - s;
      } else {
        const qq = fa / fc;
        const r = fb / fc;
        p = s * (2 * m * qq * (qq - r) - (b - a) * (r - 1));
        q = (qq - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m;
        e = m;
      }
    } else {
      d = m;
      e = m;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = f(b);
  }
  return b;
}

export interface OrbitingParameters {
  /** Radius of the unstable circular orbit, in σ. */
  orbitRadius: number;
  /** Orbiting impact parameter b_o, in σ. */
  orbitImpactParameter: number;
}

/**
 * Orbiting parameters for E* < 0.8: the barrier top of u + E b²/r² sits at energy E exactly.
 * With w = r^−6, the conditions V_eff = E, V_eff′ = 0 give E = 8w − 20w² (take the smaller root, the
 * outer maximum) and b_o² = r_o³ u′(r_o)/(2E) = r_o² · 3(1 − 2w)/(2 − 5w).
 */
export function orbitingParameters(reducedEnergy: number): OrbitingParameters | null {
  if (!(reducedEnergy > 0) || reducedEnergy >= ORBITING_REDUCED_ENERGY) return null;
  const w = (8 - Math.sqrt(64 - 80 * reducedEnergy)) / 40;
  const r = Math.pow(w, -1 / 6);
  return { orbitRadius: r, orbitImpactParameter: r * Math.sqrt((3 * (1 - 2 * w)) / (2 - 5 * w)) };
}

/** Distance of closest approach r_m (in σ): the outermost root of F(r) = 1 − b²/r² − u*(r)/E. */
export function closestApproach(impactParameter: number, reducedEnergy: number, orbit = orbitingParameters(reducedEnergy)): number {
  const b = impactParameter;
  const E = reducedEnergy;
  const F = (r: number) => 1 - (b * b) / (r * r) - potential(r) / E;
  // Inner bracket: where u* exceeds E the particle cannot be (w above the root of 4(w² − w) = E).
  const wWall = 1.01 * (0.5 * (1 + Math.sqrt(1 + E)));
  let lo = Math.pow(wWall, -1 / 6);
  let hi = Math.max(b, 1);
  if (orbit) {
    if (b > orbit.orbitImpactParameter)
      lo = orbit.orbitRadius; // outer root beyond the barrier
    else if (b < orbit.orbitImpactParameter) hi = orbit.orbitRadius; // the particle passes over the barrier
  }
  let fLo = F(lo);
  let fHi = F(hi);
  if (fHi === 0) return hi;
  if (fLo === 0) return lo;
  // Guard against rounding at the exact orbiting impact parameter.
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

/**
 * Classical deflection angle χ(b, E) in radians (b in σ, E in ε) for the LJ 12-6 potential.
 * χ = 4β ∫_0^1 D / (√H √H0 (√H + √H0)) ds with β = b/r_m, y = 1 − s², H0 = β²(1 + y),
 * D = (4/E) r_m^−6 (r_m^−6 S12(y) − S6(y)), H = H0 + D, S_n(y) = Σ_{k<n} y^k (see file header).
 */
export function deflectionAngle(impactParameter: number, reducedEnergy: number, orbit = orbitingParameters(reducedEnergy)): number {
  const b = impactParameter;
  const E = reducedEnergy;
  if (b === 0) return Math.PI;
  const rm = closestApproach(b, E, orbit);
  const beta = b / rm;
  const beta2 = beta * beta;
  const p = Math.pow(rm, -6);
  const scale = (4 * p) / E;
  const hOf = (s: number): { h: number; h0: number; d: number } => {
    const y = 1 - s * s;
    const y2 = y * y;
    const y3 = y2 * y;
    const s6 = (1 + y + y2) * (1 + y3); // 1 + y + … + y^5
    const s12 = s6 * (1 + y3 * y3); // 1 + y + … + y^11
    const h0 = beta2 * (1 + y);
    const d = scale * (p * s12 - s6);
    return { h: h0 + d, h0, d };
  };
  const integrand = (s: number): number[] => {
    const { h, h0, d } = hOf(s);
    const sh = Math.sqrt(Math.max(h, 0));
    const sh0 = Math.sqrt(h0);
    // H = 0 only at an exact orbiting point, a single abscissa of measure zero.
    return [sh > 0 ? d / (sh * sh0 * (sh + sh0)) : 0];
  };
  // Near orbiting, H nearly vanishes at one point and 1/√H has a peak of width √(H_min/c) there
  // (c = curvature of H). Geometric breakpoints around it let the adaptive rule resolve it cheaply.
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
    // The particle passes just over the barrier; its top for this b is at r_x with r³u′(r) = 2Eb²,
    // i.e. 12 w^{2/3} (1 − 2w) = E b² on the outer branch 0 < w ≤ 0.2.
    const g = (w: number) => 12 * Math.pow(w, 2 / 3) * (1 - 2 * w) - E * b * b;
    const gHi = g(0.2);
    if (gHi > 0) {
      const wTop = brentRoot(g, 1e-300, 0.2, -E * b * b, gHi);
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
  const r = integrateVector(integrand, 0, 1, 1, CHI_QUAD, breaks);
  return 4 * beta * r.values[0];
}

export interface TransportCrossSections {
  /** Q^(1)* = Q^(1)/(πσ²), 1 for rigid spheres. */
  q1: number;
  /** Q^(2)* = Q^(2)/((2/3)πσ²), 1 for rigid spheres. */
  q2: number;
}

/**
 * Reduced transport cross-sections at reduced relative kinetic energy E* = E/ε:
 * Q^(1)* = 2∫(1 − cos χ) b db, Q^(2)* = (3/2)·2∫ sin²χ b db. The b axis is split at b_o (orbiting) and
 * the tail beyond B uses b = B/t, dt-weighted by B/t², since 1 − cos χ falls off as b^−12.
 */
export function transportCrossSections(reducedEnergy: number): TransportCrossSections {
  if (!(reducedEnergy > 0) || !Number.isFinite(reducedEnergy)) {
    throw new RangeError(`reducedEnergy must be a finite number > 0 (got ${String(reducedEnergy)})`);
  }
  const E = reducedEnergy;
  const orbit = orbitingParameters(E);
  const integrand = (b: number): number[] => {
    const chi = deflectionAngle(b, E, orbit);
    const sinHalf = Math.sin(0.5 * chi);
    const sinChi = Math.sin(chi);
    // 1 − cos χ = 2 sin²(χ/2) and 1 − cos²χ = sin²χ avoid cancellation for small χ.
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
    CROSS_SECTION_QUAD,
  );
  const sum = [tail.values[0], tail.values[1]];
  const add = (v: number[]) => {
    sum[0] += v[0];
    sum[1] += v[1];
  };
  if (!orbit) {
    add(integrateVector(integrand, 0, bSplit, 2, CROSS_SECTION_QUAD).values);
  } else {
    // χ ~ ln|b − b_o| near orbiting, so in τ = ln|b − b_o| cos χ oscillates at a steady rate and the
    // Jacobian e^τ damps it. Inside the sliver |b − b_o| < g = 1e-9 b_o, χ oscillates without limit and
    // cos χ, cos²χ are replaced by their means 0 and 1/2 (error below 1e-9 of Q).
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
          CROSS_SECTION_QUAD,
        ).values,
      );
    }
    add(integrateVector(integrand, 0, bOrbit - delta, 2, CROSS_SECTION_QUAD).values);
    add(integrateVector(integrand, bOrbit + delta, bSplit, 2, CROSS_SECTION_QUAD).values);
  }
  return { q1: sum[0], q2: sum[1] };
}

export interface CollisionIntegralPoint {
  omega11: number;
  omega22: number;
  /** dΩ^(1,1)*∕dT* */
  dOmega11dT: number;
  /** dΩ^(2,2)*∕dT* */
  dOmega22dT: number;
}

function requireReducedTemperature(tStar: number): void {
  if (typeof tStar !== 'number' || !Number.isFinite(tStar) || tStar <= 0) {
    throw new RangeError(`reduced temperature tStar must be a finite number > 0 (got ${String(tStar)})`);
  }
}

/**
 * Ω^(1,1)*, Ω^(2,2)* and their T*-derivatives from the definition. With x = E/T*:
 * Ω^(l,s)* = (1/(s+1)!) ∫ e^{−x} x^{s+1} Q^(l)*(x T*) dx and, differentiating under the integral,
 * dΩ^(l,s)*∕dT* = [(1/(s+1)!) ∫ e^{−x} x^{s+2} Q^(l)* dx − (s+2) Ω^(l,s)*] / T*.
 * The x axis is split at the orbiting threshold x = 0.8/T*, where Q(E) is not smooth.
 */
export function collisionIntegralsExact(tStar: number): CollisionIntegralPoint {
  requireReducedTemperature(tStar);
  const integrand = (x: number): number[] => {
    const { q1, q2 } = transportCrossSections(x * tStar);
    const ex = Math.exp(-x);
    const x2 = x * x;
    return [ex * x2 * q1, ex * x2 * x * q1, ex * x2 * x * q2, ex * x2 * x2 * q2];
  };
  const threshold = ORBITING_REDUCED_ENERGY / tStar;
  const r = integrateVector(integrand, 0, THERMAL_UPPER_LIMIT, 4, THERMAL_QUAD, threshold < THERMAL_UPPER_LIMIT ? [threshold] : []);
  const [m2q1, m3q1, m3q2, m4q2] = r.values;
  const omega11 = m2q1 / 2;
  const omega22 = m3q2 / 6;
  return {
    omega11,
    omega22,
    dOmega11dT: (m3q1 / 2 - 3 * omega11) / tStar,
    dOmega22dT: (m4q2 / 6 - 4 * omega22) / tStar,
  };
}

/** Ω^(1,1)*(T*) from the definition (slow: seconds). */
export function omega11Exact(tStar: number): number {
  return collisionIntegralsExact(tStar).omega11;
}

/** Ω^(2,2)*(T*) from the definition (slow: seconds). */
export function omega22Exact(tStar: number): number {
  return collisionIntegralsExact(tStar).omega22;
}

/** Span of the precomputed table; the interpolated functions throw a RangeError outside it. */
export const COLLISION_TABLE_RANGE: { minReducedTemperature: number; maxReducedTemperature: number } = {
  minReducedTemperature: COLLISION_TABLE.minReducedTemperature,
  maxReducedTemperature: COLLISION_TABLE.maxReducedTemperature,
};

const LN_T_MIN = Math.log(COLLISION_TABLE.minReducedTemperature);
const LN_STEP = COLLISION_TABLE.lnStep;
const ROWS = COLLISION_TABLE.rows;

/** Column layout of a table row: [ln T*, Ω11, Ω22, dΩ11/d ln T*, dΩ22/d ln T*]. */
const COL = { omega11: 1, omega22: 2, dOmega11: 3, dOmega22: 4 } as const;

/**
 * Cubic Hermite interpolation in u = ln T* using the tabulated values and the exact node derivatives
 * (both from collisionIntegralsExact), so the interpolant and its derivative are continuous.
 * Returns [value, d value / dT*].
 */
/** The table rows bracketing T* in ln T*, their spacing h and the position t ∈ [0, 1] between them. */
function tableInterval(tStar: number) {
  const u = Math.log(tStar);
  let i = Math.floor((u - LN_T_MIN) / LN_STEP);
  if (i < 0) i = 0;
  if (i > ROWS.length - 2) i = ROWS.length - 2;
  const a = ROWS[i];
  const b = ROWS[i + 1];
  const h = b[0] - a[0];
  return { a, b, h, t: (u - a[0]) / h };
}

function interpolate(tStar: number, valueCol: number, slopeCol: number): [number, number] {
  if (typeof tStar !== 'number' || !Number.isFinite(tStar)) {
    throw new RangeError(`reduced temperature tStar must be a finite number (got ${String(tStar)})`);
  }
  const { minReducedTemperature: lo, maxReducedTemperature: hi } = COLLISION_TABLE_RANGE;
  if (tStar < lo || tStar > hi) {
    throw new RangeError(`reduced temperature tStar = ${tStar} is outside the collision-integral table range [${lo}, ${hi}]`);
  }
  const { a, b, h, t } = tableInterval(tStar);
  const t2 = t * t;
  const t3 = t2 * t;
  const value =
    (2 * t3 - 3 * t2 + 1) * a[valueCol] +
    (t3 - 2 * t2 + t) * h * a[slopeCol] +
    (-2 * t3 + 3 * t2) * b[valueCol] +
    (t3 - t2) * h * b[slopeCol];
  const dValueDu =
    ((6 * t2 - 6 * t) * a[valueCol] + (-6 * t2 + 6 * t) * b[valueCol]) / h +
    (3 * t2 - 4 * t + 1) * a[slopeCol] +
    (3 * t2 - 2 * t) * b[slopeCol];
  return [value, dValueDu / tStar];
}

/** Ω^(1,1)*(T*) interpolated from the precomputed table (microseconds). */
export function omega11(tStar: number): number {
  return interpolate(tStar, COL.omega11, COL.dOmega11)[0];
}

/** Ω^(2,2)*(T*) interpolated from the precomputed table (microseconds). */
export function omega22(tStar: number): number {
  return interpolate(tStar, COL.omega22, COL.dOmega22)[0];
}

/** dΩ^(2,2)*∕dT*, the derivative of the interpolant (consistent with omega22). */
export function omega22Derivative(tStar: number): number {
  return interpolate(tStar, COL.omega22, COL.dOmega22)[1];
}

/**
 * Ω^(2,2)* with its first and second T*-derivatives from the interpolant (second derivative of the
 * Hermite cubic: piecewise linear in ln T*, continuous to about 1e-4 relative at the nodes).
 */
export function omega22WithDerivatives(tStar: number): { omega22: number; dOmega22dT: number; d2Omega22dT2: number } {
  const [value, dValueDt] = interpolate(tStar, COL.omega22, COL.dOmega22);
  const { a, b, h, t } = tableInterval(tStar);
  const col = COL.omega22;
  const slope = COL.dOmega22;
  const d2du2 = ((12 * t - 6) * a[col] + (-12 * t + 6) * b[col]) / (h * h) + ((6 * t - 4) * a[slope] + (6 * t - 2) * b[slope]) / h;
  const dValueDu = dValueDt * tStar;
  return { omega22: value, dOmega22dT: dValueDt, d2Omega22dT2: (d2du2 - dValueDu) / (tStar * tStar) };
}

/** dΩ^(1,1)*∕dT*, the derivative of the interpolant (consistent with omega11). */
export function omega11Derivative(tStar: number): number {
  return interpolate(tStar, COL.omega11, COL.dOmega11)[1];
}

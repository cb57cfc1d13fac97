/**
 * Tension between kinds of data in a joint fit: each kind is fitted alone (where it constrains both ε and σ) and
 * the 95 % joint regions are compared. Two regions {x : (x − c)ᵀ C⁻¹ (x − c) ≤ k} overlap exactly when the point
 * minimising max(q_A/k_A, q_B/k_B) has that maximum ≤ 1; the minimiser lies on the curve of minimisers of
 * t·q_A/k_A + (1 − t)·q_B/k_B, t ∈ [0, 1] (the Pareto set of two convex quadratics), where q_A/k_A = q_B/k_B,
 * found here by bisection in t (common practice in convex analysis, no source).
 */
import { jointConfidenceEllipse } from './ellipse';
import { fitLennardJones, type FitMeasurementSet, type LjFitOptions, type LjFitResult } from './lj-fit';
import { PROPERTY_MODELS, type FitKind } from './property-models';

export interface Region {
  center: [number, number];
  covariance: number[][];
  radiusSquared: number;
}

export interface KindRegion {
  kind: FitKind;
  /** False when the kind alone cannot pin down both parameters (reason says why). */
  constrainsBoth: boolean;
  reason?: string;
  epsilonK?: number;
  sigmaAngstrom?: number;
  stdErr?: { epsilonK: number | null; sigmaAngstrom: number | null };
  ellipse95?: Array<{ epsilonK: number; sigmaAngstrom: number }>;
}

export interface KindTension {
  regions: KindRegion[];
  pairs: Array<{ kinds: [FitKind, FitKind]; overlap: boolean }>;
  /** Plain-words sentences, one per pair of kinds whose regions do not overlap. */
  messages: string[];
}

function inverse2(m: readonly (readonly number[])[]): number[][] {
  const det = m[0][0] * m[1][1] - m[0][1] * m[1][0];
  return [
    [m[1][1] / det, -m[0][1] / det],
    [-m[1][0] / det, m[0][0] / det],
  ];
}

const quadratic = (a: number[][], d: [number, number]) => a[0][0] * d[0] * d[0] + 2 * a[0][1] * d[0] * d[1] + a[1][1] * d[1] * d[1];

/** Whether two 2-D ellipsoidal regions share a point (see file header). */
export function regionsOverlap(a: Region, b: Region): boolean {
  const A = inverse2(a.covariance).map((row) => row.map((v) => v / a.radiusSquared));
  const B = inverse2(b.covariance).map((row) => row.map((v) => v / b.radiusSquared));
  const qa = (x: [number, number]) => quadratic(A, [x[0] - a.center[0], x[1] - a.center[1]]);
  const qb = (x: [number, number]) => quadratic(B, [x[0] - b.center[0], x[1] - b.center[1]]);
  if (qb(a.center) <= 1 || qa(b.center) <= 1) return true;
  const at = (t: number): [number, number] => {
    const m = [0, 1].map((i) => [0, 1].map((j) => t * A[i][j] + (1 - t) * B[i][j]));
    const rhs = [0, 1].map(
      (i) => t * (A[i][0] * a.center[0] + A[i][1] * a.center[1]) + (1 - t) * (B[i][0] * b.center[0] + B[i][1] * b.center[1]),
    );
    const inv = inverse2(m);
    return [inv[0][0] * rhs[0] + inv[0][1] * rhs[1], inv[1][0] * rhs[0] + inv[1][1] * rhs[1]];
  };
  // qa − qb rises from −qb(a) < 0 at t = 1 to qa(b) > 0 at t = 0.
  let lo = 0;
  let hi = 1;
  for (let i = 0; i < 100; i++) {
    const mid = 0.5 * (lo + hi);
    const x = at(mid);
    if (qa(x) - qb(x) > 0) lo = mid;
    else hi = mid;
  }
  return qa(at(0.5 * (lo + hi))) <= 1 + 1e-12;
}

function regionOf(fit: LjFitResult, points: number): Region | null {
  if (fit.status !== 'succeeded' || !fit.covariance || fit.dof < 1 || fit.heldParameters.length) return null;
  if (!(fit.covariance[0][0] > 0 && fit.covariance[1][1] > 0)) return null;
  try {
    const e = jointConfidenceEllipse([fit.epsilonK, fit.sigmaAngstrom], fit.covariance, fit.covarianceScaling, points);
    return { center: [fit.epsilonK, fit.sigmaAngstrom], covariance: fit.covariance, radiusSquared: e.radiusSquared };
  } catch {
    return null;
  }
}

const LABEL = (kind: FitKind) => PROPERTY_MODELS[kind].label;

/** Fits each kind of the measurement sets alone and says where their 95 % regions do not overlap. */
export function kindTension(measurementSets: readonly FitMeasurementSet[], options: LjFitOptions): KindTension {
  const kinds = [...new Set(measurementSets.map((d) => d.kind))];
  const regions: KindRegion[] = [];
  const shapes = new Map<FitKind, Region>();
  for (const kind of kinds) {
    const mine = measurementSets.filter((d) => d.kind === kind);
    const points = mine.reduce((s, d) => s + d.rows.length - (d.excludeRows?.length ?? 0), 0);
    if (points < 3) {
      regions.push({
        kind,
        constrainsBoth: false,
        reason: `${points} point(s) of the ${LABEL(kind)} alone cannot fix two parameters with an uncertainty (3 are needed)`,
      });
      continue;
    }
    let fit: LjFitResult;
    try {
      fit = fitLennardJones([...mine], { ...options, fixed: undefined, profiles: false });
    } catch (err) {
      regions.push({ kind, constrainsBoth: false, reason: `the ${LABEL(kind)} alone cannot be fitted: ${(err as Error).message}` });
      continue;
    }
    const region = regionOf(fit, points);
    if (!region || (fit.correlation !== null && Math.abs(fit.correlation) > 0.9999)) {
      regions.push({ kind, constrainsBoth: false, reason: `the ${LABEL(kind)} alone determines only a combination of ε and σ, not both` });
      continue;
    }
    shapes.set(kind, region);
    regions.push({
      kind,
      constrainsBoth: true,
      epsilonK: fit.epsilonK,
      sigmaAngstrom: fit.sigmaAngstrom,
      stdErr: fit.stdErr,
      ellipse95: fit.ellipse95?.points ?? [],
    });
  }
  const pairs: KindTension['pairs'] = [];
  const messages: string[] = [];
  const fitted = regions.filter((r) => r.constrainsBoth);
  const describe = (r: KindRegion) =>
    `${PROPERTY_MODELS[r.kind].label} alone: ε/k_B = ${r.epsilonK!.toPrecision(5)} ± ${r.stdErr!.epsilonK?.toPrecision(2)} K, σ = ${r.sigmaAngstrom!.toPrecision(5)} ± ${r.stdErr!.sigmaAngstrom?.toPrecision(2)} Å`;
  for (let i = 0; i < fitted.length; i++) {
    for (let j = i + 1; j < fitted.length; j++) {
      const [a, b] = [fitted[i], fitted[j]];
      const overlap = regionsOverlap(shapes.get(a.kind)!, shapes.get(b.kind)!);
      pairs.push({ kinds: [a.kind, b.kind], overlap });
      if (!overlap) {
        messages.push(
          `The ${LABEL(a.kind)} and the ${LABEL(b.kind)} pull the parameters apart: fitted alone, their 95 % regions do not overlap (${describe(a)}; ${describe(b)}). The joint fit is a compromise neither kind supports on its own: check both data sets and their uncertainties, or whether this potential model suits the substance.`,
        );
      }
    }
  }
  return { regions, pairs, messages };
}

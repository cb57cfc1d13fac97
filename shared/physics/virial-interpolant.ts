/**
 * Fast reduced B2*(T*) for samplers that evaluate the model hundreds of thousands of times (posterior.ts):
 * cubic Hermite interpolation in x = ln T* between nodes x_k = k·h, each node computed once by the exact
 * quadrature of virial.ts (value and d/dx = T*·dB2*∕dT*) and memoised. With h = 1/256 the interpolation error
 * is below 1e-9 of |B2*| + 1 over the supported range (virial-interpolant.test.ts checks it against the quadrature);
 * fits and reports keep using the quadrature itself.
 */
import { b2WithGradient, b2ZeroCm3PerMol } from './virial';

const STEP = 1 / 256;
/** Memoised nodes per repulsive exponent λr (12: the LJ 12-6 potential). */
const nodesByExponent = new Map<number, Map<number, [number, number]>>();

function node(k: number, n: number): [number, number] {
  let nodes = nodesByExponent.get(n);
  if (!nodes) nodesByExponent.set(n, (nodes = new Map()));
  let v = nodes.get(k);
  if (!v) {
    const tStar = Math.exp(k * STEP);
    // b2WithGradient at ε/k_B = 1 K, σ = 1 Å gives b0·B2* and ∂/∂ε = −b0·T*·dB2*∕dT*.
    const b0 = b2ZeroCm3PerMol(1);
    const p = b2WithGradient(tStar, 1, 1, undefined, { repulsiveExponent: n });
    v = [p.b2Cm3PerMol / b0, -p.dB2dEpsilonK / b0];
    nodes.set(k, v);
  }
  return v;
}

/** B2*(T*) and T*·dB2*∕dT* by Hermite interpolation (see file header). Throws outside the quadrature's range. */
export function reducedB2Interpolated(tStar: number, repulsiveExponent = 12): { b2Reduced: number; tDb2dT: number } {
  if (!(tStar > 0) || !Number.isFinite(tStar)) throw new RangeError(`tStar must be a finite number > 0 (got ${tStar})`);
  const x = Math.log(tStar) / STEP;
  const k = Math.floor(x);
  const t = x - k;
  const [f0, d0] = node(k, repulsiveExponent);
  const [f1, d1] = node(k + 1, repulsiveExponent);
  // Hermite basis on [0, 1] with derivatives scaled by the step (d/dt = STEP·d/dx).
  const t2 = t * t;
  const t3 = t2 * t;
  const h00 = 2 * t3 - 3 * t2 + 1;
  const h10 = t3 - 2 * t2 + t;
  const h01 = -2 * t3 + 3 * t2;
  const h11 = t3 - t2;
  const value = h00 * f0 + h10 * STEP * d0 + h01 * f1 + h11 * STEP * d1;
  const slope = ((6 * t2 - 6 * t) * f0 + (3 * t2 - 4 * t + 1) * STEP * d0 + (-6 * t2 + 6 * t) * f1 + (3 * t2 - 2 * t) * STEP * d1) / STEP;
  return { b2Reduced: value, tDb2dT: slope };
}

/** Classical B2 in cm³/mol with its gradient, like b2WithGradient without the quantum term, from the interpolant. */
export function b2Interpolated(
  temperatureK: number,
  epsilonK: number,
  sigmaAngstrom: number,
  repulsiveExponent = 12,
): { b2Cm3PerMol: number; dB2dEpsilonK: number; dB2dSigmaAngstrom: number } {
  const b0 = b2ZeroCm3PerMol(sigmaAngstrom);
  const { b2Reduced, tDb2dT } = reducedB2Interpolated(temperatureK / epsilonK, repulsiveExponent);
  const b2 = b0 * b2Reduced;
  return { b2Cm3PerMol: b2, dB2dEpsilonK: (-b0 * tDb2dT) / epsilonK, dB2dSigmaAngstrom: (3 * b2) / sigmaAngstrom };
}

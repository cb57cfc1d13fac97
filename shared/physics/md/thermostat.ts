/**
 * Canonical sampling through velocity rescaling (CSVR): Bussi, Donadio & Parrinello 2007,
 * J. Chem. Phys. 126, 014101, eq. (A7) and their reference implementation. The kinetic energy follows
 * a stochastic process whose stationary law is the canonical one for Nf degrees of freedom, so the
 * kinetic-energy variance is (Nf/2)·T². Only two random numbers per step (a Gaussian and a gamma deviate).
 */
import type { Xoshiro128 } from './rng';

/**
 * Gamma(shape, 1) deviate by Marsaglia & Tsang 2000 (ACM TOMS 26, 363), shape ≥ 1;
 * smaller shapes use the boost Gamma(a) = Gamma(a + 1)·U^(1/a) from the same paper.
 */
export function gammaDeviate(shape: number, rng: Xoshiro128): number {
  if (shape < 1) return gammaDeviate(shape + 1, rng) * Math.pow(rng.uniform() || Number.MIN_VALUE, 1 / shape);
  const d = shape - 1 / 3;
  const c = 1 / Math.sqrt(9 * d);
  for (;;) {
    let x: number;
    let v: number;
    do {
      x = rng.gaussian();
      v = 1 + c * x;
    } while (v <= 0);
    v = v * v * v;
    const u = rng.uniform();
    if (u < 1 - 0.0331 * x * x * x * x) return d * v;
    if (Math.log(u) < 0.5 * x * x + d * (1 - v + Math.log(v))) return d * v;
  }
}

/** Sum of `count` squared standard normals, i.e. a χ²(count) deviate. */
export function chiSquaredDeviate(count: number, rng: Xoshiro128): number {
  if (count <= 0) return 0;
  return 2 * gammaDeviate(count / 2, rng);
}

/**
 * New kinetic energy after one CSVR step of length dt with relaxation time tau.
 * Returns the factor α by which every velocity must be multiplied (negative α reverses them, as in the
 * exact solution; it happens only for tau ≲ dt).
 */
export function csvrScaleFactor(
  kinetic: number,
  degreesOfFreedom: number,
  reducedTemperature: number,
  dtOverTau: number,
  rng: Xoshiro128,
): number {
  const target = 0.5 * degreesOfFreedom * reducedTemperature;
  const c = Math.exp(-dtOverTau);
  const r1 = rng.gaussian();
  const s = chiSquaredDeviate(degreesOfFreedom - 1, rng);
  const newKinetic =
    kinetic +
    (1 - c) * ((target * (s + r1 * r1)) / degreesOfFreedom - kinetic) +
    2 * r1 * Math.sqrt(((kinetic * target) / degreesOfFreedom) * (1 - c) * c);
  const alpha = Math.sqrt(Math.max(newKinetic, 0) / kinetic);
  const sign = r1 + Math.sqrt((c * degreesOfFreedom * kinetic) / ((1 - c) * target)) < 0 ? -1 : 1;
  return sign * alpha;
}

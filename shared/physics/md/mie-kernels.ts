/**
 * The Mie λr-6 pair loops of LjSystem, chosen once per system (never a branch per pair):
 * - integer λr (8 … 36): a loop of its own with its power chain from r⁻² written out (mie-kernels.generated.ts), at the
 *   12-6 loop's speed for even λr; an odd λr adds one √(r⁻²);
 * - any other λr: r^−λr from a table of (r²)^(−λr/2) on the binary exponent and mantissa of r² (below), a few times
 *   faster than Math.pow per pair and as accurate to within a few units in the last place.
 * u = C(r^−λr − r⁻⁶), r·F = C(λr r^−λr − 6 r⁻⁶) (mie-potential.ts); README, Mie kernel benchmarks.
 */
import { miePrefactor } from '../mie-potential';
import { MIE_KERNELS } from './mie-kernels.generated';
import type { MiePairSums, MiePairSystem } from './mie-pair-system';

export interface MieKernel {
  /** Which loop runs: 'chain' (integer λr) or 'table'. */
  readonly method: 'chain' | 'table';
  forces(s: MiePairSystem): void;
  forcesAndSums(s: MiePairSystem): MiePairSums;
}

/** The loop for λr, with its constants bound; call once per system. */
export function mieKernelFor(repulsiveExponent: number): MieKernel {
  const c = miePrefactor(repulsiveExponent);
  const a = c * repulsiveExponent;
  const b = 6 * c;
  const chain = Number.isInteger(repulsiveExponent) ? MIE_KERNELS[repulsiveExponent] : undefined;
  if (chain) {
    const [forces, forcesAndSums] = chain;
    return { method: 'chain', forces: (s) => forces(s, a, b), forcesAndSums: (s) => forcesAndSums(s, a, b, c) };
  }
  const table = powerTable(repulsiveExponent);
  return { method: 'table', forces: (s) => mieForcesTable(s, a, b, table), forcesAndSums: (s) => mieForcesAndSumsTable(s, a, b, c, table) };
}

/**
 * (r²)^(−p) with r² = m·2^e, m in [1, 2): m^(−p) from a degree-6 Taylor polynomial about the centre of one of 2^9 equal
 * parts of [1, 2) (the top 9 mantissa bits pick it), times 2^(−pe) from a table over every exponent e. The remainder is
 * C(−p, 7)(δ/m)^7 with δ ≤ 2^−10: below 3e-16 relative for p ≤ 18 (λr ≤ 36); m and m − centre are exact, so the
 * result is within a few ulp of the exact power (mie-kernels.test.ts checks 1e-14 against Math.pow).
 */
export interface PowerTable {
  /** Per part: centre, then the Taylor coefficients of degree 0 … 6. */
  readonly coefficients: Float64Array;
  /** Per biased exponent E (0 … 2047): 2^−(E − 1023), then 2^(−p(E − 1023)). */
  readonly exponents: Float64Array;
}

export const TABLE_MANTISSA_BITS = 9;
const PARTS = 1 << TABLE_MANTISSA_BITS;
const STRIDE = 8;

/** The table of (r²)^(−λr/2). */
export function powerTable(repulsiveExponent: number): PowerTable {
  const p = repulsiveExponent / 2;
  const coefficients = new Float64Array(PARTS * STRIDE);
  for (let j = 0; j < PARTS; j++) {
    const centre = 1 + (j + 0.5) / PARTS;
    coefficients[STRIDE * j] = centre;
    // d^d/dm^d m^(−p) / d! = C(−p, d) m^(−p−d), built term by term.
    let term = Math.pow(centre, -p);
    for (let d = 0; d <= 6; d++) {
      coefficients[STRIDE * j + 1 + d] = term;
      term *= (-p - d) / ((d + 1) * centre);
    }
  }
  const exponents = new Float64Array(2 * 2048);
  for (let e = 0; e < 2048; e++) {
    exponents[2 * e] = Math.pow(2, -(e - 1023));
    exponents[2 * e + 1] = Math.pow(2, -p * (e - 1023));
  }
  return { coefficients, exponents };
}

// The bits of r²: written as a double, read back as two 32-bit words; the high word holds the exponent and the top
// 20 mantissa bits (which word is high depends on the platform's byte order).
const scratch = new Float64Array(1);
const words = new Int32Array(scratch.buffer);
const HIGH = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1 ? 1 : 0;
const SHIFT = 20 - TABLE_MANTISSA_BITS;
const MASK = PARTS - 1;

/** (r²)^(−λr/2) from the table, as the loops compute it (for the tests). */
export function tablePower(r2: number, table: PowerTable): number {
  const T = table.coefficients;
  const E = table.exponents;
  scratch[0] = r2;
  const hi = words[HIGH];
  const e2 = (hi >>> 20) << 1;
  const j = ((hi >>> SHIFT) & MASK) * STRIDE;
  const t = r2 * E[e2] - T[j];
  const t2 = t * t;
  // Estrin's scheme: shorter dependency chain than Horner's.
  return (T[j + 1] + T[j + 2] * t + t2 * (T[j + 3] + T[j + 4] * t) + t2 * t2 * (T[j + 5] + T[j + 6] * t + t2 * T[j + 7])) * E[e2 + 1];
}

/** Forces only, any λr, r^−λr from the table. */
function mieForcesTable(s: MiePairSystem, a: number, b: number, table: PowerTable): void {
  const n = s.n;
  const x = s.pos;
  const f = s.force;
  const list = s.nbList;
  const start = s.nbStart;
  const mid = s.nbMid;
  const rc2 = s.rc2;
  const L = s.box;
  const h = 0.5 * L;
  const T = table.coefficients;
  const E = table.exponents;
  const bits = scratch;
  const word = words;
  f.fill(0);
  for (let i = 0; i < n; i++) {
    const i3 = 3 * i;
    const xi = x[i3];
    const yi = x[i3 + 1];
    const zi = x[i3 + 2];
    let fxi = 0;
    let fyi = 0;
    let fzi = 0;
    const kMid = mid[i];
    const kEnd = start[i + 1];
    for (let k = start[i]; k < kMid; k++) {
      const j3 = 3 * list[k];
      const dx = xi - x[j3];
      const dy = yi - x[j3 + 1];
      const dz = zi - x[j3 + 2];
      const r2 = dx * dx + dy * dy + dz * dz;
      const inside = +(r2 < rc2);
      const ir2 = 1 / r2;
      const ir6 = ir2 * ir2 * ir2;
      bits[0] = r2;
      const hi = word[HIGH];
      const e2 = (hi >>> 20) << 1;
      const j = ((hi >>> SHIFT) & MASK) * STRIDE;
      const t = r2 * E[e2] - T[j];
      const t2 = t * t;
      const irn =
        (T[j + 1] + T[j + 2] * t + t2 * (T[j + 3] + T[j + 4] * t) + t2 * t2 * (T[j + 5] + T[j + 6] * t + t2 * T[j + 7])) * E[e2 + 1];
      const ff = inside * ir2 * (a * irn - b * ir6);
      const fx = ff * dx;
      const fy = ff * dy;
      const fz = ff * dz;
      fxi += fx;
      fyi += fy;
      fzi += fz;
      f[j3] -= fx;
      f[j3 + 1] -= fy;
      f[j3 + 2] -= fz;
    }
    // Partners found across a box face: minimum image.
    for (let k = kMid; k < kEnd; k++) {
      const j3 = 3 * list[k];
      let dx = xi - x[j3];
      let dy = yi - x[j3 + 1];
      let dz = zi - x[j3 + 2];
      dx -= L * (+(dx > h) - +(dx < -h));
      dy -= L * (+(dy > h) - +(dy < -h));
      dz -= L * (+(dz > h) - +(dz < -h));
      const r2 = dx * dx + dy * dy + dz * dz;
      const inside = +(r2 < rc2);
      const ir2 = 1 / r2;
      const ir6 = ir2 * ir2 * ir2;
      bits[0] = r2;
      const hi = word[HIGH];
      const e2 = (hi >>> 20) << 1;
      const j = ((hi >>> SHIFT) & MASK) * STRIDE;
      const t = r2 * E[e2] - T[j];
      const t2 = t * t;
      const irn =
        (T[j + 1] + T[j + 2] * t + t2 * (T[j + 3] + T[j + 4] * t) + t2 * t2 * (T[j + 5] + T[j + 6] * t + t2 * T[j + 7])) * E[e2 + 1];
      const ff = inside * ir2 * (a * irn - b * ir6);
      const fx = ff * dx;
      const fy = ff * dy;
      const fz = ff * dz;
      fxi += fx;
      fyi += fy;
      fzi += fz;
      f[j3] -= fx;
      f[j3 + 1] -= fy;
      f[j3 + 2] -= fz;
    }
    f[i3] += fxi;
    f[i3 + 1] += fyi;
    f[i3 + 2] += fzi;
  }
}

/** Forces and pair sums, any λr, r^−λr from the table. */
function mieForcesAndSumsTable(s: MiePairSystem, a: number, b: number, c: number, table: PowerTable): MiePairSums {
  const n = s.n;
  const x = s.pos;
  const f = s.force;
  const list = s.nbList;
  const start = s.nbStart;
  const mid = s.nbMid;
  const rc2 = s.rc2;
  const L = s.box;
  const h = 0.5 * L;
  const T = table.coefficients;
  const E = table.exponents;
  const bits = scratch;
  const word = words;
  let u = 0;
  let w = 0;
  let pairs = 0;
  f.fill(0);
  for (let i = 0; i < n; i++) {
    const i3 = 3 * i;
    const xi = x[i3];
    const yi = x[i3 + 1];
    const zi = x[i3 + 2];
    let fxi = 0;
    let fyi = 0;
    let fzi = 0;
    const kMid = mid[i];
    const kEnd = start[i + 1];
    for (let k = start[i]; k < kMid; k++) {
      const j3 = 3 * list[k];
      const dx = xi - x[j3];
      const dy = yi - x[j3 + 1];
      const dz = zi - x[j3 + 2];
      const r2 = dx * dx + dy * dy + dz * dz;
      const inside = +(r2 < rc2);
      const ir2 = 1 / r2;
      const ir6 = ir2 * ir2 * ir2;
      bits[0] = r2;
      const hi = word[HIGH];
      const e2 = (hi >>> 20) << 1;
      const j = ((hi >>> SHIFT) & MASK) * STRIDE;
      const t = r2 * E[e2] - T[j];
      const t2 = t * t;
      const irn =
        (T[j + 1] + T[j + 2] * t + t2 * (T[j + 3] + T[j + 4] * t) + t2 * t2 * (T[j + 5] + T[j + 6] * t + t2 * T[j + 7])) * E[e2 + 1];
      const ff = inside * ir2 * (a * irn - b * ir6);
      u += inside * c * (irn - ir6);
      w += ff * r2;
      pairs += inside;
      const fx = ff * dx;
      const fy = ff * dy;
      const fz = ff * dz;
      fxi += fx;
      fyi += fy;
      fzi += fz;
      f[j3] -= fx;
      f[j3 + 1] -= fy;
      f[j3 + 2] -= fz;
    }
    // Partners found across a box face: minimum image.
    for (let k = kMid; k < kEnd; k++) {
      const j3 = 3 * list[k];
      let dx = xi - x[j3];
      let dy = yi - x[j3 + 1];
      let dz = zi - x[j3 + 2];
      dx -= L * (+(dx > h) - +(dx < -h));
      dy -= L * (+(dy > h) - +(dy < -h));
      dz -= L * (+(dz > h) - +(dz < -h));
      const r2 = dx * dx + dy * dy + dz * dz;
      const inside = +(r2 < rc2);
      const ir2 = 1 / r2;
      const ir6 = ir2 * ir2 * ir2;
      bits[0] = r2;
      const hi = word[HIGH];
      const e2 = (hi >>> 20) << 1;
      const j = ((hi >>> SHIFT) & MASK) * STRIDE;
      const t = r2 * E[e2] - T[j];
      const t2 = t * t;
      const irn =
        (T[j + 1] + T[j + 2] * t + t2 * (T[j + 3] + T[j + 4] * t) + t2 * t2 * (T[j + 5] + T[j + 6] * t + t2 * T[j + 7])) * E[e2 + 1];
      const ff = inside * ir2 * (a * irn - b * ir6);
      u += inside * c * (irn - ir6);
      w += ff * r2;
      pairs += inside;
      const fx = ff * dx;
      const fy = ff * dy;
      const fz = ff * dz;
      fxi += fx;
      fyi += fy;
      fzi += fz;
      f[j3] -= fx;
      f[j3 + 1] -= fy;
      f[j3 + 2] -= fz;
    }
    f[i3] += fxi;
    f[i3 + 1] += fyi;
    f[i3 + 2] += fzi;
  }
  return { potentialTruncated: u, virial: w, pairsInside: pairs };
}

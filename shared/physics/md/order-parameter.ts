/**
 * Phase diagnostics.
 * - Global bond-orientational order Q6 (Steinhardt, Nelson & Ronchetti 1983, Phys. Rev. B 28, 784, eqs. 1.2–1.4):
 *   Q̄6m = average of Y6m(r̂) over all bonds shorter than rBond, Q6 = sqrt(4π/13 Σ_m |Q̄6m|²).
 *   Perfect fcc gives 0.57452 (their Table I); an isotropic liquid gives ≈ 0 (O(1/√bonds)).
 * - Local-density spread over sub-cells: a one-phase fluid has near-Poisson cell counts
 *   (variance/mean = S(0) = ρk_BTκ_T, below 1 for liquids), a vapour–liquid split has nearly empty cells next to
 *   full ones (variance/mean ≫ 1). Common practice, no single source.
 */

const L = 6;

// Normalisation sqrt((2l+1)/(4π)·(l−m)!/(l+m)!) for l = 6, m = 0..6.
const NORM: number[] = (() => {
  const fact = (k: number): number => (k <= 1 ? 1 : k * fact(k - 1));
  const out: number[] = [];
  for (let m = 0; m <= L; m++) out.push(Math.sqrt(((2 * L + 1) / (4 * Math.PI)) * (fact(L - m) / fact(L + m))));
  return out;
})();

/**
 * Adds Y6m(r̂) for m = 0..6 of the bond (dx, dy, dz) into re/im. Uses P6m(cosθ)e^{imφ} = p6m(z)·((x + iy)/r)^m,
 * with p6m = P6m/sin^mθ from the standard three-term recurrence in l (Abramowitz & Stegun 8.5.3); the Condon–Shortley
 * sign drops out of |Q6m|².
 */
function addY6(dx: number, dy: number, dz: number, re: Float64Array, im: Float64Array): void {
  const r = Math.sqrt(dx * dx + dy * dy + dz * dz);
  const z = dz / r;
  const cx = dx / r;
  const cy = dy / r;
  let pr = 1; // ((x + iy)/r)^m
  let pi = 0;
  let dfact = 1; // (2m − 1)!!
  for (let m = 0; m <= L; m++) {
    // p_mm = (2m − 1)!!, p_{m+1,m} = z(2m + 1)p_mm, then up to l = 6.
    let pPrev = dfact;
    let p = pPrev;
    if (m < L) {
      let pl = z * (2 * m + 1) * pPrev;
      for (let l = m + 2; l <= L; l++) {
        const next = ((2 * l - 1) * z * pl - (l + m - 1) * pPrev) / (l - m);
        pPrev = pl;
        pl = next;
      }
      p = pl;
    }
    const a = NORM[m] * p;
    re[m] += a * pr;
    im[m] += a * pi;
    const npr = pr * cx - pi * cy;
    pi = pr * cy + pi * cx;
    pr = npr;
    dfact *= 2 * m + 1;
  }
}

/** Global Q6 from a list of bond vectors (interleaved dx, dy, dz). Returns 0 for no bonds. */
export function globalQ6FromBonds(bonds: ArrayLike<number>): number {
  const re = new Float64Array(L + 1);
  const im = new Float64Array(L + 1);
  const nb = bonds.length / 3;
  if (nb === 0) return 0;
  for (let b = 0; b < nb; b++) addY6(bonds[3 * b], bonds[3 * b + 1], bonds[3 * b + 2], re, im);
  let s = (re[0] * re[0] + im[0] * im[0]) / (nb * nb);
  for (let m = 1; m <= L; m++) s += (2 * (re[m] * re[m] + im[m] * im[m])) / (nb * nb);
  return Math.sqrt(((4 * Math.PI) / (2 * L + 1)) * s);
}

export interface BondOrder {
  /** Global Q6. */
  q6: number;
  /** Bonds (pairs closer than the bond length) per atom; 6 for a perfect fcc crystal with 1.5σ bonds. */
  bondsPerAtom: number;
}

/**
 * Global Q6 of a configuration using a half neighbour list (each pair once; Y6m is even in r̂, so one direction
 * per bond suffices). Pairs are taken with the minimum image.
 */
export function globalQ6(pos: Float64Array, box: number, nbStart: Int32Array, nbList: Int32Array, n: number, bondLength = 1.5): BondOrder {
  const re = new Float64Array(L + 1);
  const im = new Float64Array(L + 1);
  const rb2 = bondLength * bondLength;
  const h = 0.5 * box;
  let nb = 0;
  for (let i = 0; i < n; i++) {
    const xi = pos[3 * i];
    const yi = pos[3 * i + 1];
    const zi = pos[3 * i + 2];
    for (let k = nbStart[i]; k < nbStart[i + 1]; k++) {
      const j3 = 3 * nbList[k];
      let dx = xi - pos[j3];
      let dy = yi - pos[j3 + 1];
      let dz = zi - pos[j3 + 2];
      // Positions lie within one box of each other between list builds: one conditional shift is the minimum image.
      if (dx > h) dx -= box;
      else if (dx < -h) dx += box;
      if (dy > h) dy -= box;
      else if (dy < -h) dy += box;
      if (dz > h) dz -= box;
      else if (dz < -h) dz += box;
      if (dx * dx + dy * dy + dz * dz < rb2) {
        addY6(dx, dy, dz, re, im);
        nb++;
      }
    }
  }
  if (nb === 0) return { q6: 0, bondsPerAtom: 0 };
  let s = (re[0] * re[0] + im[0] * im[0]) / (nb * nb);
  for (let m = 1; m <= L; m++) s += (2 * (re[m] * re[m] + im[m] * im[m])) / (nb * nb);
  return { q6: Math.sqrt(((4 * Math.PI) / (2 * L + 1)) * s), bondsPerAtom: nb / n };
}

export interface LocalDensityStats {
  /** Variance/mean of the atom counts over sub-cells (≈ 1 − 1/cells for an ideal gas, ≪ 1 for a liquid). */
  varianceToMean: number;
  /** Fraction of sub-cells holding less than half the mean count. */
  sparseFraction: number;
  /** Sub-cells per box edge. */
  cellsPerEdge: number;
}

/** Counts atoms in m³ sub-cells with about 16 atoms each on average (m ≥ 2). */
export function localDensityStats(pos: Float64Array, box: number, n: number): LocalDensityStats {
  const m = Math.max(2, Math.floor(Math.cbrt(n / 16)));
  const cells = m * m * m;
  const counts = new Float64Array(cells);
  const inv = m / box;
  for (let i = 0; i < n; i++) {
    const c = [0, 1, 2].map((d) => {
      let x = pos[3 * i + d];
      x -= box * Math.floor(x / box);
      return Math.min(m - 1, Math.floor(x * inv));
    });
    counts[(c[2] * m + c[1]) * m + c[0]]++;
  }
  const meanCount = n / cells;
  let v = 0;
  let sparse = 0;
  for (let c = 0; c < cells; c++) {
    v += (counts[c] - meanCount) * (counts[c] - meanCount);
    if (counts[c] < 0.5 * meanCount) sparse++;
  }
  return { varianceToMean: v / cells / meanCount, sparseFraction: sparse / cells, cellsPerEdge: m };
}

export type Phase = 'fluid' | 'solid' | 'two-phase';

/** Thresholds: Q6 ≥ 0.3 is an ordered solid (fcc 0.575, bcc 0.511, liquid ≈ 0.02–0.05 for a few hundred atoms). */
export const SOLID_Q6_THRESHOLD = 0.3;
/** Variance/mean above 3 with ≥ 10 % sparse sub-cells is a vapour–liquid split (a homogeneous fluid stays near or below 1). */
export const TWO_PHASE_VARIANCE_RATIO = 3;
export const TWO_PHASE_SPARSE_FRACTION = 0.1;

/** A solid needs a dense bond network: at least 3 bonds per atom (coordination 6) inside 1.5σ. */
export const SOLID_MIN_BONDS_PER_ATOM = 3;

export function classifyPhase(q6Mean: number, varianceToMeanMean: number, sparseFractionMean: number, bondsPerAtomMean: number): Phase {
  if (q6Mean >= SOLID_Q6_THRESHOLD && bondsPerAtomMean >= SOLID_MIN_BONDS_PER_ATOM) return 'solid';
  if (varianceToMeanMean > TWO_PHASE_VARIANCE_RATIO && sparseFractionMean >= TWO_PHASE_SPARSE_FRACTION) return 'two-phase';
  return 'fluid';
}

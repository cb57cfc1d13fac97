/**
 * Lennard-Jones 12-6 particle system in reduced units (σ = ε = m = k_B = 1): cubic periodic box,
 * cell list feeding a half Verlet neighbour list with a skin, forces by Newton's third law.
 *
 * Method: Verlet neighbour list (Verlet 1967, Phys. Rev. 159, 98) built from a link-cell grid
 * (Allen & Tildesley, Computer Simulation of Liquids, 2nd ed. 2017, §5.3–5.4); cells of edge ≥ r_list/2
 * searched two cells deep over the forward half of the stencil, so each pair is met once.
 * At every build the atoms are re-sorted by cell so that neighbours sit close in memory.
 * Each atom's list has two segments: partners found without a periodic image (no minimum-image
 * arithmetic needed in the force loop) and partners across a box face (minimum image applied).
 * With a repulsive exponent λr ≠ 12 the pair potential is the Mie λr-6 form (mie-potential.ts).
 */
import { LJ_REPULSIVE_EXPONENT, miePrefactor } from '../mie-potential';
import { mieKernelFor, type MieKernel } from './mie-kernels';

/** u(r) = 4(r⁻¹² − r⁻⁶); with a repulsive exponent λr ≠ 12 the Mie form C(r^−λr − r⁻⁶) (mie-potential.ts). */
export function ljPairEnergy(r: number, repulsiveExponent = LJ_REPULSIVE_EXPONENT): number {
  const ir6 = 1 / (r * r * r * r * r * r);
  if (repulsiveExponent !== LJ_REPULSIVE_EXPONENT) return miePrefactor(repulsiveExponent) * (Math.pow(r, -repulsiveExponent) - ir6);
  return 4 * ir6 * (ir6 - 1);
}

/**
 * Long-range tail correction to the potential energy per atom for a cut at rc, assuming g(r) = 1 beyond rc:
 * U_tail/N = (8/3)πρ[(1/3)rc⁻⁹ − rc⁻³] (Allen & Tildesley 2017, eq. 2.144).
 */
export function tailEnergyPerAtom(reducedDensity: number, cutoff: number, repulsiveExponent = LJ_REPULSIVE_EXPONENT): number {
  const ir3 = 1 / (cutoff * cutoff * cutoff);
  if (repulsiveExponent !== LJ_REPULSIVE_EXPONENT) {
    // Mie: 2πρ ∫_rc^∞ u r² dr = 2πρC[rc^(3−λr)/(λr − 3) − rc⁻³/3]; λr = 12 gives the line below.
    const n = repulsiveExponent;
    return 2 * Math.PI * reducedDensity * miePrefactor(n) * (Math.pow(cutoff, 3 - n) / (n - 3) - ir3 / 3);
  }
  return (8 / 3) * Math.PI * reducedDensity * ((ir3 * ir3 * ir3) / 3 - ir3);
}

/** Tail correction to the pressure: P_tail = (16/3)πρ²[(2/3)rc⁻⁹ − rc⁻³] (Allen & Tildesley 2017, eq. 2.145). */
export function tailPressure(reducedDensity: number, cutoff: number, repulsiveExponent = LJ_REPULSIVE_EXPONENT): number {
  const ir3 = 1 / (cutoff * cutoff * cutoff);
  if (repulsiveExponent !== LJ_REPULSIVE_EXPONENT) {
    // Mie: (2π/3)ρ² ∫_rc^∞ r³(−du/dr) dr = (2π/3)ρ²C[λr rc^(3−λr)/(λr − 3) − 2 rc⁻³]; λr = 12 gives the line below.
    const n = repulsiveExponent;
    return ((2 * Math.PI) / 3) * reducedDensity * reducedDensity * miePrefactor(n) * ((n * Math.pow(cutoff, 3 - n)) / (n - 3) - 2 * ir3);
  }
  return (16 / 3) * Math.PI * reducedDensity * reducedDensity * ((2 / 3) * ir3 * ir3 * ir3 - ir3);
}

/**
 * Mean-field value of the potential shift per atom, (1/2)ρ(4π/3)rc³·u(rc): the energy the shifted potential
 * removes if g(r) = 1 inside rc. Its volume derivative is exactly the impulsive pressure term
 * (2π/3)ρ²rc³u(rc), so U_shifted + U_tail(V) + this term is a Hamiltonian whose virial pressure equals the
 * usual truncated-force virial + P_tail (derivation in the doc comment of npt.ts).
 */
export function meanFieldShiftPerAtom(reducedDensity: number, cutoff: number, repulsiveExponent = LJ_REPULSIVE_EXPONENT): number {
  return ((2 * Math.PI) / 3) * reducedDensity * cutoff * cutoff * cutoff * ljPairEnergy(cutoff, repulsiveExponent);
}

/** Sums over pairs inside rc from the last energy evaluation. */
export interface PairSums {
  /** Σ u(r) over pairs inside rc, truncated, not shifted. */
  potentialTruncated: number;
  /** Σ r·F over pairs inside rc (the pair virial W; P = ρT + W/(3V)). */
  virial: number;
  /** Number of pairs inside rc. */
  pairsInside: number;
}

/** Upper bound on cells: about one per atom, so a dilute gas does not loop over thousands of empty cells. */
function maxCells(atoms: number): number {
  return Math.max(125, Math.min(4096, atoms));
}

export class LjSystem {
  readonly n: number;
  readonly cutoff: number;
  readonly skin: number;
  /** λr of the Mie λr-6 pair potential (12: the LJ 12-6 kernel). */
  readonly repulsiveExponent: number;
  readonly rc2: number;
  readonly rlist2: number;
  box = 0;
  private halfBox = 0;
  /** Interleaved positions, velocities, forces (x, y, z per atom). Arrays are swapped at each list build. */
  pos: Float64Array;
  vel: Float64Array;
  force: Float64Array;
  private ref: Float64Array;
  private spare: [Float64Array, Float64Array, Float64Array];
  /** Number of neighbour-list builds so far. */
  builds = 0;
  /** Product of the uniform scalings applied since the last build (volume moves); 1 right after a build. */
  private listScale = 1;

  // Neighbour list in CSR form: partners of i are nbList[nbStart[i] .. nbStart[i+1]); those before nbMid[i] need no image.
  nbStart: Int32Array;
  nbMid: Int32Array;
  nbList: Int32Array;

  // Cell grid: m cells per edge (0 = all-pairs build for small boxes).
  private m = 0;
  private rows: number[] = []; // (dy, dz, dxLo, dxHi) per stencil row
  private stencilCells = 0;
  private cellStart = new Int32Array(1);
  private cellFill = new Int32Array(1);
  private cellOf: Int32Array;
  // Per cell, 2·rows ranges of cells [lo, hi) with an image shift; zero-shift ranges first.
  private rangeLo = new Int32Array(0);
  private rangeHi = new Int32Array(0);
  private rangeShift = new Float64Array(0);
  private rangeZero = new Int32Array(0);
  private rangesPerCell = 0;

  constructor(positions: Float64Array, box: number, cutoff: number, skin: number, repulsiveExponent = LJ_REPULSIVE_EXPONENT) {
    this.n = positions.length / 3;
    this.repulsiveExponent = repulsiveExponent;
    this.mieKernel = repulsiveExponent === LJ_REPULSIVE_EXPONENT ? null : mieKernelFor(repulsiveExponent);
    this.cutoff = cutoff;
    this.skin = skin;
    this.rc2 = cutoff * cutoff;
    this.rlist2 = (cutoff + skin) * (cutoff + skin);
    this.pos = Float64Array.from(positions);
    this.vel = new Float64Array(3 * this.n);
    this.force = new Float64Array(3 * this.n);
    this.ref = new Float64Array(3 * this.n);
    this.spare = [new Float64Array(3 * this.n), new Float64Array(3 * this.n), new Float64Array(3 * this.n)];
    this.cellOf = new Int32Array(this.n);
    this.nbStart = new Int32Array(this.n + 1);
    this.nbMid = new Int32Array(this.n);
    this.nbList = new Int32Array(64 * this.n);
    this.setBox(box);
  }

  get volume(): number {
    return this.box * this.box * this.box;
  }

  get density(): number {
    return this.n / this.volume;
  }

  /** Sets the box edge and rebuilds the cell grid; positions are left as they are (call buildList after). */
  setBox(box: number): void {
    this.box = box;
    this.halfBox = 0.5 * box;
    const rlist = Math.sqrt(this.rlist2);
    let m = Math.floor((2 * box) / rlist);
    while (m * m * m > maxCells(this.n)) m--;
    if (m < 5) m = 0;
    if (m === 0) {
      this.m = 0;
      return;
    }
    const w = box / m;
    // Forward half stencil two cells deep, each (dy, dz) row a run of dx; cells whose nearest
    // approach to the home cell exceeds r_list are dropped.
    const rows: number[] = [];
    let stencilCells = 0;
    for (let dz = -2; dz <= 2; dz++) {
      for (let dy = -2; dy <= 2; dy++) {
        let lo = 3;
        let hi = -3;
        for (let dx = -2; dx <= 2; dx++) {
          const forward = dz > 0 || (dz === 0 && (dy > 0 || (dy === 0 && dx > 0)));
          const gx = dx !== 0 ? (Math.abs(dx) - 1) * w : 0;
          const gy = dy !== 0 ? (Math.abs(dy) - 1) * w : 0;
          const gz = dz !== 0 ? (Math.abs(dz) - 1) * w : 0;
          if (forward && gx * gx + gy * gy + gz * gz < this.rlist2) {
            lo = Math.min(lo, dx);
            hi = Math.max(hi, dx);
          }
        }
        if (lo <= hi) {
          rows.push(dy, dz, lo, hi);
          stencilCells += hi - lo + 1;
        }
      }
    }
    if (m === this.m && rows.length === this.rows.length && rows.every((r, k) => r === this.rows[k])) {
      // Same grid and stencil: only the image shifts scale with the box (done at the next build).
      return;
    }
    this.m = m;
    this.rows = rows;
    this.stencilCells = stencilCells;
    const nrow = rows.length / 4;
    const nc3 = m * m * m;
    const rpc = 2 * nrow;
    this.rangesPerCell = rpc;
    this.cellStart = new Int32Array(nc3 + 1);
    this.cellFill = new Int32Array(nc3);
    this.rangeLo = new Int32Array(nc3 * rpc);
    this.rangeHi = new Int32Array(nc3 * rpc);
    this.rangeShift = new Float64Array(3 * nc3 * rpc);
    this.rangeZero = new Int32Array(nc3);
    this.fillRanges();
  }

  private fillRanges(): void {
    const m = this.m;
    const rows = this.rows;
    const rpc = this.rangesPerCell;
    const zero: number[] = [];
    const shifted: number[] = [];
    for (let cz = 0; cz < m; cz++) {
      for (let cy = 0; cy < m; cy++) {
        for (let cx = 0; cx < m; cx++) {
          const c = (cz * m + cy) * m + cx;
          zero.length = 0;
          shifted.length = 0;
          for (let r = 0; r < rows.length; r += 4) {
            const y = cy + rows[r];
            const z = cz + rows[r + 1];
            const iy = y < 0 ? -1 : y >= m ? 1 : 0;
            const iz = z < 0 ? -1 : z >= m ? 1 : 0;
            const base = ((z - iz * m) * m + (y - iy * m)) * m;
            const x0 = cx + rows[r + 2];
            const x1 = cx + rows[r + 3];
            // Split the run where it crosses x = 0 or x = m; each part has one image shift (ix, iy, iz).
            const parts: number[] = [];
            if (x0 < 0) parts.push(x0 + m, m - 1, -1, 0, x1, 0);
            else if (x1 >= m) parts.push(x0, m - 1, 0, 0, x1 - m, 1);
            else parts.push(x0, x1, 0);
            for (let p = 0; p < parts.length; p += 3) {
              const entry = [base + parts[p], base + parts[p + 1] + 1, parts[p + 2], iy, iz];
              if (parts[p + 2] === 0 && iy === 0 && iz === 0) zero.push(...entry);
              else shifted.push(...entry);
            }
          }
          const all = zero.concat(shifted);
          this.rangeZero[c] = zero.length / 5;
          for (let k = 0; k < rpc; k++) {
            const e = c * rpc + k;
            if (5 * k < all.length) {
              this.rangeLo[e] = all[5 * k];
              this.rangeHi[e] = all[5 * k + 1];
              this.rangeShift[3 * e] = all[5 * k + 2] * this.box;
              this.rangeShift[3 * e + 1] = all[5 * k + 3] * this.box;
              this.rangeShift[3 * e + 2] = all[5 * k + 4] * this.box;
            } else {
              this.rangeLo[e] = 0;
              this.rangeHi[e] = 0;
            }
          }
        }
      }
    }
  }

  /** Rescales the image shifts after a box change that kept the cell count. */
  private rescaleShifts(): void {
    const rs = this.rangeShift;
    const L = this.box;
    for (let k = 0; k < rs.length; k++) {
      const s = rs[k];
      rs[k] = s > 0 ? L : s < 0 ? -L : 0;
    }
  }

  private ensureCapacity(need: number): void {
    if (need <= this.nbList.length) return;
    const grown = new Int32Array(Math.max(need, Math.floor(this.nbList.length * 1.5)));
    grown.set(this.nbList);
    this.nbList = grown;
  }

  /** Largest squared displacement of any atom since the last list build. */
  maxDisplacement2(): number {
    const x = this.pos;
    const x0 = this.ref;
    let max = 0;
    for (let k = 0; k < x.length; k += 3) {
      const ux = x[k] - x0[k];
      const uy = x[k + 1] - x0[k + 1];
      const uz = x[k + 2] - x0[k + 2];
      const d2 = ux * ux + uy * uy + uz * uz;
      if (d2 > max) max = d2;
    }
    return max;
  }

  /**
   * True once the list may miss a pair inside rc. A pair left out was at least r_list apart at the build; after
   * uniform scalings by s (volume moves, positions and build references scaled alike) it is still ≥ s·r_list apart
   * in the reference frame, so it stays outside rc while every atom has moved less than (s·r_list − rc)/2 from its
   * scaled reference. With s = 1 this is the usual half-skin rule.
   */
  needsRebuild(): boolean {
    const margin = 0.5 * (this.listScale * (this.cutoff + this.skin) - this.cutoff);
    return margin <= 0 || this.maxDisplacement2() > margin * margin;
  }

  /**
   * Scales positions, build references and the box by `factor` without rebuilding the list (the image
   * relationships of listed pairs are unchanged by a uniform scaling). Call needsRebuild() afterwards.
   */
  scaleBox(factor: number): void {
    const x = this.pos;
    const r = this.ref;
    for (let k = 0; k < x.length; k++) {
      x[k] *= factor;
      r[k] *= factor;
    }
    this.listScale *= factor;
    this.setBox(this.box * factor);
  }

  /** Wraps positions into the box, re-sorts atoms by cell and rebuilds the half neighbour list. */
  buildList(): void {
    const n = this.n;
    const L = this.box;
    const pos = this.pos;
    for (let k = 0; k < 3 * n; k++) {
      let x = pos[k];
      x -= L * Math.floor(x / L);
      if (x >= L) x -= L;
      pos[k] = x;
    }
    this.builds++;
    this.listScale = 1;
    if (this.m === 0) {
      this.ref.set(pos);
      this.buildAllPairs();
      return;
    }
    if (this.rangeShift.length > 0) this.rescaleShifts();
    const m = this.m;
    const nc3 = m * m * m;
    const cinv = m / L;
    const cellStart = this.cellStart;
    const cellOf = this.cellOf;
    cellStart.fill(0);
    for (let i = 0; i < n; i++) {
      let cx = (pos[3 * i] * cinv) | 0;
      let cy = (pos[3 * i + 1] * cinv) | 0;
      let cz = (pos[3 * i + 2] * cinv) | 0;
      if (cx >= m) cx = m - 1;
      if (cy >= m) cy = m - 1;
      if (cz >= m) cz = m - 1;
      const c = (cz * m + cy) * m + cx;
      cellOf[i] = c;
      cellStart[c + 1]++;
    }
    let maxOcc = 0;
    for (let c = 0; c < nc3; c++) {
      if (cellStart[c + 1] > maxOcc) maxOcc = cellStart[c + 1];
      cellStart[c + 1] += cellStart[c];
    }
    // Counting sort: atoms move to their cell-ordered slot, dragging velocity and force along.
    const fill = this.cellFill;
    fill.set(cellStart.subarray(0, nc3));
    const [np, nv, nf] = this.spare;
    const vel = this.vel;
    const force = this.force;
    for (let i = 0; i < n; i++) {
      const s = fill[cellOf[i]]++;
      const a = 3 * i;
      const b = 3 * s;
      np[b] = pos[a];
      np[b + 1] = pos[a + 1];
      np[b + 2] = pos[a + 2];
      nv[b] = vel[a];
      nv[b + 1] = vel[a + 1];
      nv[b + 2] = vel[a + 2];
      nf[b] = force[a];
      nf[b + 1] = force[a + 1];
      nf[b + 2] = force[a + 2];
    }
    this.spare = [pos, vel, force];
    this.pos = np;
    this.vel = nv;
    this.force = nf;
    this.ref.set(np);

    const maxCandidates = (this.stencilCells + 1) * maxOcc;
    this.ensureCapacity(Math.max(n * 48, maxCandidates));
    for (;;) {
      const p = findPairs(
        np,
        this.rlist2,
        nc3,
        this.rangesPerCell,
        cellStart,
        this.rangeLo,
        this.rangeHi,
        this.rangeShift,
        this.rangeZero,
        this.nbStart,
        this.nbMid,
        this.nbList,
        maxCandidates,
      );
      if (p >= 0) break;
      this.ensureCapacity(this.nbList.length * 2);
    }
  }

  /** All pairs with minimum image, for boxes too small for a 5-cell grid. */
  private buildAllPairs(): void {
    const n = this.n;
    const x = this.pos;
    const L = this.box;
    const h = this.halfBox;
    const rlist2 = this.rlist2;
    this.ensureCapacity((n * (n - 1)) / 2 + 1);
    const list = this.nbList;
    let p = 0;
    for (let i = 0; i < n; i++) {
      this.nbStart[i] = p;
      this.nbMid[i] = p;
      const xi = x[3 * i];
      const yi = x[3 * i + 1];
      const zi = x[3 * i + 2];
      for (let j = i + 1; j < n; j++) {
        let dx = xi - x[3 * j];
        let dy = yi - x[3 * j + 1];
        let dz = zi - x[3 * j + 2];
        if (dx > h) dx -= L;
        else if (dx < -h) dx += L;
        if (dy > h) dy -= L;
        else if (dy < -h) dy += L;
        if (dz > h) dz -= L;
        else if (dz < -h) dz += L;
        list[p] = j;
        p += +(dx * dx + dy * dy + dz * dz < rlist2);
      }
    }
    this.nbStart[n] = p;
  }

  /** Forces only (the hot loop of every MD step). */
  computeForces(): void {
    if (this.repulsiveExponent !== LJ_REPULSIVE_EXPONENT) {
      this.mieForces();
      return;
    }
    const n = this.n;
    const x = this.pos;
    const f = this.force;
    const list = this.nbList;
    const start = this.nbStart;
    const mid = this.nbMid;
    const rc2 = this.rc2;
    const L = this.box;
    const h = this.halfBox;
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
        // Branch-free cut: pairs beyond rc (about 30 % of the list) get a zero force instead of a mispredicted jump.
        const ir2 = 1 / r2;
        const ir6 = ir2 * ir2 * ir2;
        const ff = +(r2 < rc2) * (48 * ir2 * ir6 * (ir6 - 0.5));
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
      for (let k = kMid; k < kEnd; k++) {
        const j3 = 3 * list[k];
        let dx = xi - x[j3];
        let dy = yi - x[j3 + 1];
        let dz = zi - x[j3 + 2];
        dx -= L * (+(dx > h) - +(dx < -h));
        dy -= L * (+(dy > h) - +(dy < -h));
        dz -= L * (+(dz > h) - +(dz < -h));
        const r2 = dx * dx + dy * dy + dz * dz;
        const ir2 = 1 / r2;
        const ir6 = ir2 * ir2 * ir2;
        const ff = +(r2 < rc2) * (48 * ir2 * ir6 * (ir6 - 0.5));
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

  /**
   * Forces plus the pair sums (energy, virial, pairs inside rc) in one pass; same branch-free cut as computeForces.
   * The pair kernel is written out in each loop on purpose: a call per pair in these loops costs speed the
   * benchmark measures (`npm run -s bench:md`), so the repetition stays, checked by the direct-sum force tests.
   */
  computeForcesAndEnergy(): PairSums {
    if (this.repulsiveExponent !== LJ_REPULSIVE_EXPONENT) return this.mieForcesAndEnergy();
    const n = this.n;
    const x = this.pos;
    const f = this.force;
    const list = this.nbList;
    const start = this.nbStart;
    const mid = this.nbMid;
    const rc2 = this.rc2;
    const L = this.box;
    const h = this.halfBox;
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
        const ff = inside * (48 * ir2 * ir6 * (ir6 - 0.5));
        u += inside * (4 * ir6 * (ir6 - 1));
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
        const ff = inside * (48 * ir2 * ir6 * (ir6 - 0.5));
        u += inside * (4 * ir6 * (ir6 - 1));
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

  /** The Mie λr-6 loops (mie-kernels.ts), chosen once here; null for λr = 12, which runs the 12-6 loops above. */
  private readonly mieKernel: MieKernel | null;

  /** Mie forces only. */
  private mieForces(): void {
    this.mieKernel!.forces(this);
  }

  /** Mie forces and pair sums. */
  private mieForcesAndEnergy(): PairSums {
    return this.mieKernel!.forcesAndSums(this);
  }

  /** Σ ½v² (m = 1). */
  kineticEnergy(): number {
    const v = this.vel;
    let s = 0;
    for (let k = 0; k < v.length; k++) s += v[k] * v[k];
    return 0.5 * s;
  }

  /**
   * Velocity Verlet first half: v += ½dt·f, x += dt·v, fused with the largest squared displacement since the
   * last build (one pass over the atoms instead of two). Returns true when the list must be rebuilt.
   */
  kickDrift(dt: number): boolean {
    const hdt = 0.5 * dt;
    const x = this.pos;
    const v = this.vel;
    const f = this.force;
    const x0 = this.ref;
    let max = 0;
    for (let k = 0; k < x.length; k += 3) {
      v[k] += hdt * f[k];
      v[k + 1] += hdt * f[k + 1];
      v[k + 2] += hdt * f[k + 2];
      x[k] += dt * v[k];
      x[k + 1] += dt * v[k + 1];
      x[k + 2] += dt * v[k + 2];
      const ux = x[k] - x0[k];
      const uy = x[k + 1] - x0[k + 1];
      const uz = x[k + 2] - x0[k + 2];
      const d2 = ux * ux + uy * uy + uz * uz;
      if (d2 > max) max = d2;
    }
    const margin = 0.5 * (this.listScale * (this.cutoff + this.skin) - this.cutoff);
    return margin <= 0 || max > margin * margin;
  }

  /** Velocity Verlet second half: v += ½dt·f. */
  kick(dt: number): void {
    const hdt = 0.5 * dt;
    const v = this.vel;
    const f = this.force;
    for (let k = 0; k < v.length; k++) v[k] += hdt * f[k];
  }

  private saved: { pos: Float64Array; vel: Float64Array; force: Float64Array; ref: Float64Array } | null = null;
  private savedBox = 0;
  private savedScale = 1;
  private savedBuilds = 0;

  /** Remembers the mutable state so that a rejected Monte Carlo move can be undone with restoreState(). */
  saveState(): void {
    if (!this.saved) {
      const k = 3 * this.n;
      this.saved = { pos: new Float64Array(k), vel: new Float64Array(k), force: new Float64Array(k), ref: new Float64Array(k) };
    }
    this.saved.pos.set(this.pos);
    this.saved.vel.set(this.vel);
    this.saved.force.set(this.force);
    this.saved.ref.set(this.ref);
    this.savedBox = this.box;
    this.savedScale = this.listScale;
    this.savedBuilds = this.builds;
  }

  /** Undoes everything since saveState(); rebuilds the list only if one was built in between (atoms re-sorted). */
  restoreState(): void {
    const s = this.saved;
    if (!s) throw new Error('restoreState() without saveState()');
    const rebuilt = this.builds !== this.savedBuilds;
    this.pos.set(s.pos);
    this.vel.set(s.vel);
    this.force.set(s.force);
    this.setBox(this.savedBox);
    if (rebuilt) {
      this.buildList();
    } else {
      this.ref.set(s.ref);
      this.listScale = this.savedScale;
    }
  }
}

/**
 * Cell-ordered half-list search (atoms already sorted by cell, so cell c holds atoms cellStart[c] … cellStart[c+1]).
 * Candidates are appended branch-free: the slot is always written and the count advances only when accepted.
 * Returns the number of pairs, or −1 if the list array ran short (the caller grows it and retries).
 */
function findPairs(
  x: Float64Array,
  rlist2: number,
  nc3: number,
  rpc: number,
  cellStart: Int32Array,
  rangeLo: Int32Array,
  rangeHi: Int32Array,
  rangeShift: Float64Array,
  rangeZero: Int32Array,
  start: Int32Array,
  mid: Int32Array,
  list: Int32Array,
  maxCandidates: number,
): number {
  const cap = list.length;
  let p = 0;
  for (let c = 0; c < nc3; c++) {
    const own1 = cellStart[c + 1];
    const e0 = c * rpc;
    const eZero = e0 + rangeZero[c];
    const eEnd = e0 + rpc;
    for (let i = cellStart[c]; i < own1; i++) {
      if (p + maxCandidates > cap) return -1;
      const xi = x[3 * i];
      const yi = x[3 * i + 1];
      const zi = x[3 * i + 2];
      start[i] = p;
      for (let j = i + 1; j < own1; j++) {
        const dx = xi - x[3 * j];
        const dy = yi - x[3 * j + 1];
        const dz = zi - x[3 * j + 2];
        list[p] = j;
        p += +(dx * dx + dy * dy + dz * dz < rlist2);
      }
      for (let e = e0; e < eZero; e++) {
        const jEnd = cellStart[rangeHi[e]];
        for (let j = cellStart[rangeLo[e]]; j < jEnd; j++) {
          const dx = xi - x[3 * j];
          const dy = yi - x[3 * j + 1];
          const dz = zi - x[3 * j + 2];
          list[p] = j;
          p += +(dx * dx + dy * dy + dz * dz < rlist2);
        }
      }
      mid[i] = p;
      for (let e = eZero; e < eEnd; e++) {
        const jEnd = cellStart[rangeHi[e]];
        const xs = xi - rangeShift[3 * e];
        const ys = yi - rangeShift[3 * e + 1];
        const zs = zi - rangeShift[3 * e + 2];
        for (let j = cellStart[rangeLo[e]]; j < jEnd; j++) {
          const dx = xs - x[3 * j];
          const dy = ys - x[3 * j + 1];
          const dz = zs - x[3 * j + 2];
          list[p] = j;
          p += +(dx * dx + dy * dy + dz * dz < rlist2);
        }
      }
    }
  }
  start[x.length / 3] = p;
  return p;
}

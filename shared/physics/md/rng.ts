/**
 * Seeded, deterministic random numbers for the MD engine.
 * xoshiro128** (Blackman & Vigna 2018, "Scrambled linear pseudorandom number generators",
 * https://prng.di.unimi.it/xoshiro128starstar.c) seeded by splitmix32 so any 32-bit seed
 * gives a well-mixed non-zero state; Gaussian deviates by the Marsaglia polar method
 * (Marsaglia & Bray 1964, SIAM Rev. 6, 260).
 */
export class Xoshiro128 {
  private s0 = 0;
  private s1 = 0;
  private s2 = 0;
  private s3 = 0;
  private spare = 0;
  private hasSpare = false;

  constructor(seed: number) {
    // splitmix32 (a 32-bit variant of Steele, Lea & Flood 2014 SplitMix) fills the state.
    let z = seed >>> 0;
    const next = (): number => {
      z = (z + 0x9e3779b9) >>> 0;
      let t = z;
      t = Math.imul(t ^ (t >>> 16), 0x85ebca6b);
      t = Math.imul(t ^ (t >>> 13), 0xc2b2ae35);
      return (t ^ (t >>> 16)) >>> 0;
    };
    this.s0 = next();
    this.s1 = next();
    this.s2 = next();
    this.s3 = next();
    if ((this.s0 | this.s1 | this.s2 | this.s3) === 0) this.s0 = 1;
  }

  /** Generator with an explicit state (for checks against published output). */
  static fromState(s0: number, s1: number, s2: number, s3: number): Xoshiro128 {
    const g = new Xoshiro128(0);
    g.s0 = s0 | 0;
    g.s1 = s1 | 0;
    g.s2 = s2 | 0;
    g.s3 = s3 | 0;
    return g;
  }

  /** Next raw 32-bit output as an unsigned integer. */
  nextUint32(): number {
    const s0 = this.s0;
    const s1 = this.s1;
    const s2 = this.s2;
    const s3 = this.s3;
    const x = Math.imul(s1, 5);
    const result = Math.imul((x << 7) | (x >>> 25), 9) >>> 0;
    const t = s1 << 9;
    let n2 = s2 ^ s0;
    let n3 = s3 ^ s1;
    const n1 = s1 ^ n2;
    const n0 = s0 ^ n3;
    n2 ^= t;
    n3 = (n3 << 11) | (n3 >>> 21);
    this.s0 = n0;
    this.s1 = n1;
    this.s2 = n2;
    this.s3 = n3;
    return result;
  }

  /** Uniform deviate in [0, 1) with 53 random bits. */
  uniform(): number {
    const hi = this.nextUint32() >>> 5; // 27 bits
    const lo = this.nextUint32() >>> 6; // 26 bits
    return (hi * 67108864 + lo) / 9007199254740992;
  }

  /** Standard normal deviate N(0, 1). */
  gaussian(): number {
    if (this.hasSpare) {
      this.hasSpare = false;
      return this.spare;
    }
    let u: number;
    let v: number;
    let s: number;
    do {
      u = 2 * this.uniform() - 1;
      v = 2 * this.uniform() - 1;
      s = u * u + v * v;
    } while (s >= 1 || s === 0);
    const f = Math.sqrt((-2 * Math.log(s)) / s);
    this.spare = v * f;
    this.hasSpare = true;
    return u * f;
  }
}

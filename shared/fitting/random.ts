/**
 * Small seeded pseudo-random generators, so restarts and synthetic tests are reproducible.
 * mulberry32 (T. Ettinger, public-domain 32-bit generator; passes PractRand to 2^32 outputs, common practice, no formal source)
 * and Gaussian deviates by the Box–Muller transform (Box & Muller, Ann. Math. Stat. 29, 610, 1958).
 */
export function mulberry32(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Standard normal deviates from a uniform generator on [0, 1). */
export function gaussianGenerator(uniform: () => number): () => number {
  let spare: number | null = null;
  return () => {
    if (spare !== null) {
      const value = spare;
      spare = null;
      return value;
    }
    let u = 0;
    while (u === 0) u = uniform();
    const v = uniform();
    const radius = Math.sqrt(-2 * Math.log(u));
    spare = radius * Math.sin(2 * Math.PI * v);
    return radius * Math.cos(2 * Math.PI * v);
  };
}

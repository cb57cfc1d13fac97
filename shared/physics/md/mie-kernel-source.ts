/**
 * Writes the source of mie-kernels.generated.ts: one Mie λr-6 pair loop per integer λr from 8 to 36, each with its own
 * power chain from r⁻² written out, so the JIT compiles every λr as tightly as the 12-6 loop (no branch, select or
 * Math.pow per pair). Run by scripts/generate-mie-kernels.ts; mie-kernels.test.ts checks that the file is up to date.
 *
 * A chain is an addition chain (Knuth, TAOCP vol. 2, §4.6.3) over the powers of r⁻² that reaches both 3 (r⁻⁶, the
 * attraction) and ⌊λr/2⌋ after as few dependent multiplications as possible; an odd λr multiplies by √(r⁻²) = r⁻¹ once.
 */

/** The integer λr that get a loop of their own (the whole range Epsigma accepts). */
export const GENERATED_MIE_EXPONENTS: readonly number[] = Array.from({ length: 29 }, (_, k) => 8 + k);

/**
 * The addition chain from 1 that contains every target with the fewest dependent multiplications on the way to the
 * targets (the latency the loop waits for), then the fewest multiplications; found by trying every ascending chain
 * up to two members longer than the shortest (targets ≤ 18: a few thousand chains).
 */
export function additionChain(targets: readonly number[]): number[] {
  const top = Math.max(...targets);
  let best: { chain: number[]; depth: number } | null = null;
  let shortest = Infinity;
  const visit = (chain: number[], depths: number[]): void => {
    if (targets.every((t) => chain.includes(t))) {
      const depth = Math.max(...targets.map((t) => depths[chain.indexOf(t)]));
      shortest = Math.min(shortest, chain.length);
      if (!best || depth < best.depth || (depth === best.depth && chain.length < best.chain.length)) best = { chain, depth };
      return;
    }
    if (chain.length >= Math.min(shortest + 2, 10)) return;
    const last = chain[chain.length - 1];
    for (let i = 0; i < chain.length; i++) {
      for (let j = i; j < chain.length; j++) {
        const sum = chain[i] + chain[j];
        // Each sum once: from the pair with the smallest depth.
        if (sum <= last || sum > top) continue;
        const depth = 1 + Math.max(depths[i], depths[j]);
        if (splitOf(chain, depths, sum).depth !== depth) continue;
        visit([...chain, sum], [...depths, depth]);
      }
    }
  };
  visit([1], [0]);
  if (!best) throw new Error(`no addition chain for ${targets.join(', ')}`);
  return (best as { chain: number[] }).chain;
}

/** The two earlier members whose product gives `sum` soonest (smallest depth, then the first found). */
function splitOf(chain: readonly number[], depths: readonly number[], sum: number): { a: number; b: number; depth: number } {
  let found = { a: 0, b: 0, depth: Infinity };
  for (let i = 0; i < chain.length; i++) {
    const j = chain.indexOf(sum - chain[i]);
    if (j < i) continue;
    const depth = 1 + Math.max(depths[i], depths[j]);
    if (depth < found.depth) found = { a: chain[i], b: chain[j], depth };
  }
  return found;
}

/** Lines computing q<k> = (r⁻²)^k for the chain of λr, then `irn` = r^−λr and `ir6` = r⁻⁶. */
export function powerChainLines(repulsiveExponent: number): string[] {
  const half = Math.floor(repulsiveExponent / 2);
  const chain = additionChain([3, half]);
  const name = (e: number) => (e === 1 ? 'ir2' : `q${e}`);
  const lines: string[] = [];
  const depths = [0];
  for (let k = 1; k < chain.length; k++) {
    const split = splitOf(chain.slice(0, k), depths, chain[k]);
    depths.push(split.depth);
    lines.push(`const ${name(chain[k])} = ${name(split.a)} * ${name(split.b)};`);
  }
  lines.push(`const ir6 = q3;`);
  lines.push(repulsiveExponent % 2 === 1 ? `const irn = ${name(half)} * Math.sqrt(ir2);` : `const irn = ${name(half)};`);
  return lines;
}

function loop(repulsiveExponent: number, withSums: boolean, minimumImage: boolean): string {
  const position = minimumImage
    ? [
        'let dx = xi - x[j3];',
        'let dy = yi - x[j3 + 1];',
        'let dz = zi - x[j3 + 2];',
        'dx -= L * (+(dx > h) - +(dx < -h));',
        'dy -= L * (+(dy > h) - +(dy < -h));',
        'dz -= L * (+(dz > h) - +(dz < -h));',
      ]
    : ['const dx = xi - x[j3];', 'const dy = yi - x[j3 + 1];', 'const dz = zi - x[j3 + 2];'];
  const body = [
    'const j3 = 3 * list[k];',
    ...position,
    'const r2 = dx * dx + dy * dy + dz * dz;',
    'const inside = +(r2 < rc2);',
    'const ir2 = 1 / r2;',
    ...powerChainLines(repulsiveExponent),
    'const ff = inside * ir2 * (a * irn - b * ir6);',
    ...(withSums ? ['u += inside * c * (irn - ir6);', 'w += ff * r2;', 'pairs += inside;'] : []),
    'const fx = ff * dx;',
    'const fy = ff * dy;',
    'const fz = ff * dz;',
    'fxi += fx;',
    'fyi += fy;',
    'fzi += fz;',
    'f[j3] -= fx;',
    'f[j3 + 1] -= fy;',
    'f[j3 + 2] -= fz;',
  ];
  const head = minimumImage ? 'for (let k = kMid; k < kEnd; k++) {' : 'for (let k = start[i]; k < kMid; k++) {';
  return [head, ...body.map((l) => `  ${l}`), '}'].map((l) => `    ${l}`).join('\n');
}

function kernel(repulsiveExponent: number, withSums: boolean): string {
  const name = `${withSums ? 'mieForcesAndSums' : 'mieForces'}${repulsiveExponent}`;
  const doc = withSums ? `/** Forces and pair sums, λr = ${repulsiveExponent}. */` : `/** Forces only, λr = ${repulsiveExponent}. */`;
  const signature = withSums
    ? `export function ${name}(s: MiePairSystem, a: number, b: number, c: number): MiePairSums {`
    : `export function ${name}(s: MiePairSystem, a: number, b: number): void {`;
  return [
    doc,
    signature,
    '  const n = s.n;',
    '  const x = s.pos;',
    '  const f = s.force;',
    '  const list = s.nbList;',
    '  const start = s.nbStart;',
    '  const mid = s.nbMid;',
    '  const rc2 = s.rc2;',
    '  const L = s.box;',
    '  const h = 0.5 * L;',
    ...(withSums ? ['  let u = 0;', '  let w = 0;', '  let pairs = 0;'] : []),
    '  f.fill(0);',
    '  for (let i = 0; i < n; i++) {',
    '    const i3 = 3 * i;',
    '    const xi = x[i3];',
    '    const yi = x[i3 + 1];',
    '    const zi = x[i3 + 2];',
    '    let fxi = 0;',
    '    let fyi = 0;',
    '    let fzi = 0;',
    '    const kMid = mid[i];',
    '    const kEnd = start[i + 1];',
    loop(repulsiveExponent, withSums, false),
    loop(repulsiveExponent, withSums, true),
    '    f[i3] += fxi;',
    '    f[i3 + 1] += fyi;',
    '    f[i3 + 2] += fzi;',
    '  }',
    ...(withSums ? ['  return { potentialTruncated: u, virial: w, pairsInside: pairs };'] : []),
    '}',
  ].join('\n');
}

/** The whole generated file, laid out as Prettier (.prettierrc.json) would lay it out. */
export function mieKernelSource(): string {
  const header = [
    '// Generated by scripts/generate-mie-kernels.ts from shared/physics/md/mie-kernel-source.ts; do not edit by hand.',
    '// Mie λr-6 pair loops for integer λr: u = c(r^−λr − r⁻⁶), r·F = c(λr r^−λr − 6 r⁻⁶); a = cλr, b = 6c.',
    '// Same list layout, two segments and branch-free cut as the 12-6 loops of lj-system.ts.',
    "import type { MiePairSums, MiePairSystem } from './mie-pair-system';",
    '',
  ];
  const kernels = GENERATED_MIE_EXPONENTS.flatMap((n) => [kernel(n, false), kernel(n, true)]);
  const table = [
    'type Forces = (s: MiePairSystem, a: number, b: number) => void;',
    'type ForcesAndSums = (s: MiePairSystem, a: number, b: number, c: number) => MiePairSums;',
    '',
    '/** The loops by λr: [forces only, forces and pair sums]. */',
    'export const MIE_KERNELS: Readonly<Record<number, readonly [Forces, ForcesAndSums]>> = {',
    ...GENERATED_MIE_EXPONENTS.map((n) => `  ${n}: [mieForces${n}, mieForcesAndSums${n}],`),
    '};',
  ];
  return [...header, kernels.join('\n\n'), '', ...table, ''].join('\n');
}

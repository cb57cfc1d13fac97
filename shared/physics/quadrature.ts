/**
 * Adaptive Gauss–Kronrod quadrature (10-point Gauss, 21-point Kronrod) with global
 * subdivision of the interval with the largest error estimate, as in QUADPACK's QAG
 * (Piessens, de Doncker-Kapenga, Überhuber & Kahaner, "QUADPACK", Springer 1983, routine QK21).
 * Semi-infinite intervals use the transformation of QUADPACK's QAGI, x = a + (1 − t)/t.
 *
 * The integrand may be vector-valued (all components share the nodes), which lets one pass
 * compute several moments of an expensive function at once.
 */

/** Kronrod abscissae of QK21 on [−1, 1] (QUADPACK, Piessens et al. 1983); index 1, 3, …, 9 are the Gauss nodes, 10 is 0. */
export const KRONROD21_NODES: readonly number[] = [
  0.995657163025808080735527280689003, 0.973906528517171720077964012084452, 0.930157491355708226001207180059508,
  0.865063366688984510732096688423493, 0.780817726586416897063717578345042, 0.679409568299024406234327365114874,
  0.562757134668604683339000099272694, 0.433395394129247190799265943165784, 0.294392862701460198131126603103866,
  0.14887433898163121088482600112972, 0,
];

/** Kronrod weights of QK21 (QUADPACK, Piessens et al. 1983), matching KRONROD21_NODES. */
export const KRONROD21_WEIGHTS: readonly number[] = [
  0.011694638867371874278064396062192, 0.03255816230796472747881897245939, 0.05475589657435199603138130024458,
  0.07503967481091995276704314091619, 0.093125454583697605535065465083366, 0.109387158802297641899210590325805,
  0.123491976262065851077208802064532, 0.134709217311473325928054001771707, 0.142775938577060080797094273138717,
  0.147739104901338491374841515972068, 0.149445554002916905664936468389821,
];

/** Weights of the embedded 10-point Gauss–Legendre rule, for nodes KRONROD21_NODES[1], [3], [5], [7], [9]. */
export const GAUSS10_WEIGHTS: readonly number[] = [
  0.066671344308688137593568809893332, 0.149451349150580593145776339657697, 0.219086362515982043995534934228163,
  0.269266719309996355091226921569469, 0.295524224714752870173892994651338,
];

export interface QuadratureOptions {
  /** Requested relative accuracy; default 1e-10. */
  relativeTolerance?: number;
  /** Requested absolute accuracy; default 0. The loop stops when error ≤ max(absolute, relative·|I|). */
  absoluteTolerance?: number;
  /** Maximum number of subintervals; default 2000. */
  maxSubintervals?: number;
}

export interface QuadratureResult {
  value: number;
  /** Estimated absolute error (QUADPACK's scaled |K21 − G10|). */
  errorEstimate: number;
  subintervals: number;
  /** False when the subdivision limit stopped the loop before the tolerance was met. */
  converged: boolean;
}

export interface VectorQuadratureResult {
  values: number[];
  errorEstimates: number[];
  subintervals: number;
  converged: boolean;
}

type VectorIntegrand = (x: number) => ArrayLike<number>;

interface Panel {
  a: number;
  b: number;
  values: number[];
  errors: number[];
  /** Largest component error relative to that component's tolerance share, used to pick the next panel. */
  priority: number;
}

const EPSILON = Number.EPSILON;

/** One QK21 panel on [a, b] for an n-component integrand: the Kronrod sums and QUADPACK's error estimate. */
function kronrodPanel(f: VectorIntegrand, a: number, b: number, n: number): { values: number[]; errors: number[] } {
  const centre = 0.5 * (a + b);
  const halfLength = 0.5 * (b - a);
  const absHalf = Math.abs(halfLength);
  const fc = f(centre);
  const resK = new Array<number>(n).fill(0);
  const resG = new Array<number>(n).fill(0);
  const resAbs = new Array<number>(n).fill(0);
  const samples: ArrayLike<number>[] = new Array(21);
  for (let c = 0; c < n; c++) {
    resK[c] = KRONROD21_WEIGHTS[10] * fc[c];
    resAbs[c] = KRONROD21_WEIGHTS[10] * Math.abs(fc[c]);
  }
  samples[20] = fc;
  for (let j = 0; j < 10; j++) {
    const dx = halfLength * KRONROD21_NODES[j];
    const f1 = f(centre - dx);
    const f2 = f(centre + dx);
    samples[2 * j] = f1;
    samples[2 * j + 1] = f2;
    const wk = KRONROD21_WEIGHTS[j];
    const gaussIndex = j % 2 === 1 ? (j - 1) / 2 : -1;
    for (let c = 0; c < n; c++) {
      resK[c] += wk * (f1[c] + f2[c]);
      resAbs[c] += wk * (Math.abs(f1[c]) + Math.abs(f2[c]));
      if (gaussIndex >= 0) resG[c] += GAUSS10_WEIGHTS[gaussIndex] * (f1[c] + f2[c]);
    }
  }
  const values = new Array<number>(n);
  const errors = new Array<number>(n);
  for (let c = 0; c < n; c++) {
    // QUADPACK's error heuristic: scale |K − G| by the variation about the mean (resasc).
    const mean = resK[c] * 0.5;
    let resAsc = KRONROD21_WEIGHTS[10] * Math.abs(fc[c] - mean);
    for (let j = 0; j < 10; j++) {
      resAsc += KRONROD21_WEIGHTS[j] * (Math.abs(samples[2 * j][c] - mean) + Math.abs(samples[2 * j + 1][c] - mean));
    }
    resAsc *= absHalf;
    const result = resK[c] * halfLength;
    const absResult = resAbs[c] * absHalf;
    let err = Math.abs((resK[c] - resG[c]) * halfLength);
    if (resAsc !== 0 && err !== 0) err = resAsc * Math.min(1, Math.pow((200 * err) / resAsc, 1.5));
    if (absResult > Number.MIN_VALUE / (50 * EPSILON)) err = Math.max(50 * EPSILON * absResult, err);
    values[c] = result;
    errors[c] = err;
  }
  return { values, errors };
}

function checkOptions(options: QuadratureOptions): Required<QuadratureOptions> {
  const relativeTolerance = options.relativeTolerance ?? 1e-10;
  const absoluteTolerance = options.absoluteTolerance ?? 0;
  const maxSubintervals = options.maxSubintervals ?? 2000;
  if (!(relativeTolerance >= 0) || !(absoluteTolerance >= 0) || (relativeTolerance === 0 && absoluteTolerance === 0)) {
    throw new RangeError('quadrature: relativeTolerance and absoluteTolerance must be ≥ 0 and not both 0');
  }
  if (!Number.isInteger(maxSubintervals) || maxSubintervals < 1) {
    throw new RangeError('quadrature: maxSubintervals must be a positive integer');
  }
  return { relativeTolerance, absoluteTolerance, maxSubintervals };
}

/**
 * Integrates an n-component function over the finite interval [a, b] (optionally split at
 * interior breakpoints where the integrand is not smooth). Each component must meet
 * error ≤ max(absoluteTolerance, relativeTolerance·|I_c|).
 */
export function integrateVector(
  f: VectorIntegrand,
  a: number,
  b: number,
  components: number,
  options: QuadratureOptions = {},
  breakpoints: readonly number[] = [],
): VectorQuadratureResult {
  const { relativeTolerance, absoluteTolerance, maxSubintervals } = checkOptions(options);
  if (!Number.isFinite(a) || !Number.isFinite(b)) throw new RangeError('integrateVector: limits must be finite');
  const n = components;
  const cuts = [a, ...breakpoints.filter((p) => (p - a) * (b - p) > 0).sort((p, q) => (a < b ? p - q : q - p)), b];
  const panels: Panel[] = [];
  for (let i = 0; i + 1 < cuts.length; i++) {
    if (cuts[i] === cuts[i + 1]) continue;
    const r = kronrodPanel(f, cuts[i], cuts[i + 1], n);
    panels.push({ a: cuts[i], b: cuts[i + 1], values: r.values, errors: r.errors, priority: 0 });
  }
  const totals = new Array<number>(n).fill(0);
  const totalErrors = new Array<number>(n).fill(0);
  let converged = false;
  for (;;) {
    totals.fill(0);
    totalErrors.fill(0);
    for (const p of panels) {
      for (let c = 0; c < n; c++) {
        totals[c] += p.values[c];
        totalErrors[c] += p.errors[c];
      }
    }
    const tolerances = totals.map((t) => Math.max(absoluteTolerance, relativeTolerance * Math.abs(t)));
    if (totalErrors.every((e, c) => e <= tolerances[c])) {
      converged = true;
      break;
    }
    if (panels.length >= maxSubintervals) break;
    // Bisect the panel whose error is largest relative to the tolerance of that component.
    let worst = 0;
    let worstPriority = -1;
    for (let i = 0; i < panels.length; i++) {
      const p = panels[i];
      let pr = 0;
      for (let c = 0; c < n; c++) {
        const scale = tolerances[c] > 0 ? tolerances[c] : Number.MIN_VALUE;
        pr = Math.max(pr, p.errors[c] / scale);
      }
      p.priority = pr;
      if (pr > worstPriority) {
        worstPriority = pr;
        worst = i;
      }
    }
    const p = panels[worst];
    const mid = 0.5 * (p.a + p.b);
    if (mid === p.a || mid === p.b) break; // cannot subdivide further in double precision
    const left = kronrodPanel(f, p.a, mid, n);
    const right = kronrodPanel(f, mid, p.b, n);
    panels[worst] = { a: p.a, b: mid, values: left.values, errors: left.errors, priority: 0 };
    panels.push({ a: mid, b: p.b, values: right.values, errors: right.errors, priority: 0 });
  }
  return { values: totals.slice(), errorEstimates: totalErrors.slice(), subintervals: panels.length, converged };
}

/** Scalar adaptive G10K21 integration of f over the finite interval [a, b]. */
export function integrate(
  f: (x: number) => number,
  a: number,
  b: number,
  options: QuadratureOptions = {},
  breakpoints: readonly number[] = [],
): QuadratureResult {
  const r = integrateVector((x) => [f(x)], a, b, 1, options, breakpoints);
  return { value: r.values[0], errorEstimate: r.errorEstimates[0], subintervals: r.subintervals, converged: r.converged };
}

/**
 * ∫_a^∞ f(x) dx via x = a + (1 − t)/t, dx = dt/t² (QUADPACK QAGI), for an n-component integrand.
 * Suits integrands that decay at least like x^−2; GK nodes never touch t = 0.
 */
export function integrateVectorToInfinity(
  f: VectorIntegrand,
  a: number,
  components: number,
  options: QuadratureOptions = {},
): VectorQuadratureResult {
  if (!Number.isFinite(a)) throw new RangeError('integrateVectorToInfinity: lower limit must be finite');
  const out = new Array<number>(components);
  const g = (t: number): number[] => {
    const x = a + (1 - t) / t;
    const jac = 1 / (t * t);
    const v = f(x);
    for (let c = 0; c < components; c++) out[c] = v[c] * jac;
    return out.slice();
  };
  return integrateVector(g, 0, 1, components, options);
}

/** Scalar ∫_a^∞ f(x) dx (see integrateVectorToInfinity). */
export function integrateToInfinity(f: (x: number) => number, a: number, options: QuadratureOptions = {}): QuadratureResult {
  const r = integrateVectorToInfinity((x) => [f(x)], a, 1, options);
  return { value: r.values[0], errorEstimate: r.errorEstimates[0], subintervals: r.subintervals, converged: r.converged };
}

/**
 * Profile χ² of one fitted parameter: χ²(v) minimised over the other parameters with this one held at v,
 * minus the overall minimum. Where Δχ² first reaches the threshold on each side gives an interval that
 * follows the curvature of χ² instead of its local quadratic approximation (Press et al., "Numerical
 * Recipes", 3rd ed. (2007), §15.6.5: Δχ² = 1 for one parameter at 68.3 %; Bates & Watts, "Nonlinear
 * Regression Analysis and Its Applications" (1988), §6.1, profile t). When the standard errors are
 * scaled by the reduced χ² (the uncertainties taken as relative), the threshold is scaled alike (1·χ²/ν),
 * so the profile interval and the linearised ±1 standard error answer the same question.
 */

export interface ProfileCurve {
  /** Values of the parameter, in its unit, in increasing order. */
  values: number[];
  /** χ²(value, others re-optimised) − χ²min at each value. */
  deltaChi2: number[];
  /** Where Δχ² reaches `threshold` below and above the best value; null if not reached in the scanned range. */
  lower: number | null;
  upper: number | null;
  /** Δχ² level of the interval: 1, times χ²/ν when the standard errors are scaled by it. */
  threshold: number;
}

export interface ProfileScan {
  best: number;
  /** Linearised standard error (sets the scanned range: ±`spanInStandardErrors` of it). */
  standardError: number;
  chi2Min: number;
  threshold: number;
  bounds: readonly [number, number];
  /**
   * χ² at the value with the other parameters re-optimised from `warm` (the other parameters found at a
   * neighbouring value); returns the χ² and the re-optimised others, or null where the model cannot be evaluated.
   */
  chi2At: (value: number, warm: number[]) => { chi2: number; others: number[] } | null;
  /** Best values of the other parameters (the warm start at the minimum). */
  othersAtBest: number[];
  /** Points on each side of the best value (default 6). */
  pointsPerSide?: number;
  spanInStandardErrors?: number;
  /** Bisection steps that refine each crossing (default 10). */
  refineSteps?: number;
}

/** Scans the profile outward from the best value on both sides and refines where it crosses the threshold. */
export function profileChi2(scan: ProfileScan): ProfileCurve {
  const perSide = scan.pointsPerSide ?? 6;
  const span = (scan.spanInStandardErrors ?? 3) * scan.standardError;
  const refine = scan.refineSteps ?? 10;
  const [lo, hi] = scan.bounds;
  const left: Array<{ v: number; d: number }> = [];
  const right: Array<{ v: number; d: number }> = [];
  const crossings: Array<number | null> = [null, null];

  for (const [side, out] of [
    [-1, left],
    [1, right],
  ] as const) {
    let warm = scan.othersAtBest;
    let previous = { v: scan.best, d: 0, warm };
    for (let k = 1; k <= perSide; k++) {
      const v = Math.min(Math.max(scan.best + (side * span * k) / perSide, lo), hi);
      if (v === previous.v) break;
      const at = scan.chi2At(v, warm);
      if (!at) break;
      const d = at.chi2 - scan.chi2Min;
      out.push({ v, d });
      if (crossings[side < 0 ? 0 : 1] === null && d >= scan.threshold && previous.d < scan.threshold) {
        // Bisection between the last point below the threshold and this one.
        let a = previous;
        let b = { v, d, warm: at.others };
        for (let s = 0; s < refine; s++) {
          const mid = 0.5 * (a.v + b.v);
          const m = scan.chi2At(mid, a.warm);
          if (!m) break;
          const dm = m.chi2 - scan.chi2Min;
          if (dm < scan.threshold) a = { v: mid, d: dm, warm: m.others };
          else b = { v: mid, d: dm, warm: m.others };
        }
        // Linear interpolation inside the last bracket.
        const t = b.d > a.d ? (scan.threshold - a.d) / (b.d - a.d) : 0.5;
        crossings[side < 0 ? 0 : 1] = a.v + t * (b.v - a.v);
      }
      warm = at.others;
      previous = { v, d, warm };
    }
  }
  const points = [...left.reverse(), { v: scan.best, d: 0 }, ...right];
  return {
    values: points.map((p) => p.v),
    deltaChi2: points.map((p) => Math.max(0, p.d)),
    lower: crossings[0],
    upper: crossings[1],
    threshold: scan.threshold,
  };
}

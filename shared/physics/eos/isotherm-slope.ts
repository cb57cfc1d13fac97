/**
 * The two searches every LJ equation of state here needs for its critical point (∂P/∂ρ = ∂²P/∂ρ² = 0):
 * the minimum of (∂P/∂ρ)_T over a density window (coarse scan in steps of 0.01, then golden-section search),
 * and the temperature where that minimum first reaches zero (bisection in T*). Pure functions of the
 * equation's slope, so JZG 1993, Kolafa–Nezbeda 1994 and Thol 2016 share one implementation.
 */

/** Minimum of slope(ρ*) over [from, to]: a coarse scan so the golden-section search starts in the right basin. */
export function minimumIsothermSlope(
  slope: (rho: number) => number,
  window: { from: number; to: number; tolerance: number },
): { rho: number; slope: number } {
  let best = window.from;
  let bestSlope = Number.POSITIVE_INFINITY;
  for (let rho = window.from; rho <= window.to + 1e-12; rho += 0.01) {
    const s = slope(rho);
    if (s < bestSlope) {
      bestSlope = s;
      best = rho;
    }
  }
  let lo = best - 0.01;
  let hi = best + 0.01;
  const phi = (Math.sqrt(5) - 1) / 2;
  let c = hi - phi * (hi - lo);
  let d = lo + phi * (hi - lo);
  let fc = slope(c);
  let fd = slope(d);
  while (hi - lo > window.tolerance) {
    if (fc < fd) {
      hi = d;
      d = c;
      fd = fc;
      c = hi - phi * (hi - lo);
      fc = slope(c);
    } else {
      lo = c;
      c = d;
      fc = fd;
      d = lo + phi * (hi - lo);
      fd = slope(d);
    }
  }
  const rho = (lo + hi) / 2;
  return { rho, slope: slope(rho) };
}

/** The T* in [lo, hi] where minSlopeAt(T*) changes sign from negative (a loop) to positive, by bisection to 1e-11. */
export function criticalTemperature(minSlopeAt: (t: number) => number, lo: number, hi: number): number {
  while (hi - lo > 1e-11) {
    const mid = (lo + hi) / 2;
    if (minSlopeAt(mid) < 0) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

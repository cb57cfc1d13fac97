/**
 * What a fit uses when the request leaves an option out: one place for the server, the command line and the fit form,
 * so the form shows exactly what the server would do with an empty field.
 */

/** Bounds used when none are given: wide enough for helium (ε/k ≈ 10 K) to large organic molecules. */
export const DEFAULT_LJ_BOUNDS: { epsilonK: [number, number]; sigmaAngstrom: [number, number] } = {
  epsilonK: [1, 5000],
  sigmaAngstrom: [1, 15],
};

/** Perturbed restarts after the first start: a guard against a poor local minimum. */
export const DEFAULT_RESTARTS = 2;

/**
 * Engine settings of the density fit's simulations when the request names none: 128 atoms (the smallest box that
 * holds rc = 2.5σ twice at liquid densities) and 5000 steps, which every run extends by itself towards 50 effectively
 * independent samples (up to 20 000 steps): ρ* to about 0.5–1 % per run with an honest error, about a second of one
 * core each. Reweighting pools the runs, so the fit's predictions hold more samples than any one run.
 */
export const DENSITY_FIT_DEFAULTS = { atoms: 128, steps: 5000, cutoff: 2.5, scheme: 'truncated-tail' as const, seed: 20261201 };

/** Steps per walker kept by the posterior sampler when the request names none. */
export const DEFAULT_POSTERIOR_SAMPLES = 1000;

/** Seed of the posterior sampler when the request names none (kept beside the sampler). */
export { POSTERIOR_SEED } from './posterior';

/** The held Mie exponent the fit form offers first (the README's example); the server has none: a Mie request names it. */
export const SUGGESTED_REPULSIVE_EXPONENT = 16;

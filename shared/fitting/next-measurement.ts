/**
 * The next measurement to make: candidate measurements ranked by how much each would shrink the parameter
 * uncertainty, by the D-optimal criterion (Atkinson, Donev & Tobias, "Optimum Experimental Designs", 2007, ch. 10).
 * Adding one point with weighted gradient g/u to the information matrix F = C⁻¹ gives, by the matrix determinant
 * lemma, det C' / det C = 1 / (1 + gᵀ C g / u²), where C is the unscaled covariance (JᵀWJ)⁻¹ and u the kind's
 * typical standard uncertainty at that point. The area of the joint confidence region scales as √det C.
 */
import type { FitMeasurementSet, LjFitResult, LjParameter } from './lj-fit';
import { PROPERTY_MODELS, type FitKind, type PropertyContext } from './property-models';

/** u(value) = max(floor, relative·|value|), in the kind's unit. */
export interface TypicalUncertainty {
  floor: number;
  relative: number;
}

/**
 * Typical uncertainties of a kind when the fit has no data of it: B2 2 % or 1 cm³/mol, dilute-gas viscosity 0.5 %,
 * liquid density 0.2 % (common practice, no source).
 */
export const DEFAULT_TYPICAL_UNCERTAINTY: Partial<Record<FitKind, TypicalUncertainty>> = {
  b2: { floor: 1, relative: 0.02 },
  viscosity: { floor: 0, relative: 0.005 },
  density: { floor: 0, relative: 0.002 },
};

export interface Candidate {
  kind: FitKind;
  temperatureK: number;
  pressureMPa?: number;
}

export interface Suggestion extends Candidate {
  unit: string;
  /** Model value at the fit's parameters. */
  predicted: number;
  /** The uncertainty assumed for the new point. */
  typicalUncertainty: number;
  /** det C' / det C after adding the point. */
  determinantRatio: number;
  /** 100·(1 − det C'/det C). */
  determinantDecreasePercent: number;
  /** 100·(1 − √(det C'/det C)): how much smaller the joint 95 % region's area becomes. */
  areaDecreasePercent: number;
  text: string;
}

export interface NextMeasurementOptions {
  /** Kinds to consider (default: every kind the model can evaluate with the context). */
  kinds?: FitKind[];
  /** Override the typical uncertainty of a kind. */
  typicalUncertainty?: Partial<Record<FitKind, TypicalUncertainty>>;
  /** Candidates to rank instead of the default grid. */
  candidates?: Candidate[];
  /** Pressures for density candidates (default: the fit's own density pressures, else 1, 10 and 50 MPa). */
  densityPressuresMPa?: number[];
  /** How many suggestions to return (default 5). */
  top?: number;
}

const median = (values: number[]): number => {
  const s = [...values].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
};

/**
 * The typical uncertainty of a kind from the fit's own data of that kind: the floor is the smallest stated u; the
 * relative part is the median u/|value| of the rows above that floor (rows at the floor say nothing about it, so
 * when every row is at the floor the kind's default relative part is used).
 */
export function typicalUncertaintyFromData(measurementSets: readonly FitMeasurementSet[], kind: FitKind): TypicalUncertainty {
  const rows = measurementSets.filter((d) => d.kind === kind).flatMap((d) => d.rows);
  // A kind without a default here (a kind added later) is taken at 1 % (common practice, no source).
  const fallback = DEFAULT_TYPICAL_UNCERTAINTY[kind] ?? { floor: 0, relative: 0.01 };
  if (rows.length === 0) return fallback;
  const floor = Math.min(...rows.map((r) => r.uncertainty));
  const above = rows.filter((r) => r.value !== 0 && r.uncertainty > 1.01 * floor);
  return { floor, relative: above.length ? median(above.map((r) => r.uncertainty / Math.abs(r.value))) : fallback.relative };
}

const geometric = (lo: number, hi: number, n: number) => Array.from({ length: n }, (_, i) => lo * Math.pow(hi / lo, i / (n - 1)));

/** Default candidates: B2 over 0.6 ≤ T* ≤ 10, viscosity over 0.5 ≤ T* ≤ 30, densities over 0.7 ≤ T* ≤ 1.3 at a few pressures. */
export function defaultCandidates(
  fit: Pick<LjFitResult, 'epsilonK'>,
  kinds: readonly FitKind[],
  densityPressuresMPa: readonly number[],
): Candidate[] {
  const eps = fit.epsilonK;
  const round = (t: number) => Math.round(t * 10) / 10;
  const out: Candidate[] = [];
  if (kinds.includes('b2')) geometric(0.6, 10, 25).forEach((t) => out.push({ kind: 'b2', temperatureK: round(t * eps) }));
  if (kinds.includes('viscosity')) geometric(0.5, 30, 25).forEach((t) => out.push({ kind: 'viscosity', temperatureK: round(t * eps) }));
  if (kinds.includes('density'))
    geometric(0.7, 1.3, 7).forEach((t) =>
      densityPressuresMPa.forEach((p) => out.push({ kind: 'density', temperatureK: round(t * eps), pressureMPa: p })),
    );
  return out;
}

const KIND_WORDS: Partial<Record<FitKind, string>> = { b2: 'B2', viscosity: 'a viscosity', density: 'a density' };

/**
 * Ranks candidate measurements for a succeeded fit (best first). Candidates where the model cannot be evaluated are
 * skipped. Held parameters are left out of the determinant (only the free ones are uncertain).
 */
export function rankNextMeasurements(
  fit: LjFitResult,
  measurementSets: readonly FitMeasurementSet[],
  context: PropertyContext,
  options: NextMeasurementOptions = {},
): Suggestion[] {
  if (fit.status !== 'succeeded' || !fit.covarianceUnscaled)
    throw new Error('ranking next measurements needs a succeeded fit with a covariance');
  const names: LjParameter[] = ['epsilonK', 'sigmaAngstrom'];
  const free = [0, 1].filter((k) => !fit.heldParameters.includes(names[k]));
  const c = fit.covarianceUnscaled;
  const kinds =
    options.kinds ??
    (Object.keys(PROPERTY_MODELS) as FitKind[]).filter((k) => !PROPERTY_MODELS[k].needsMolarMass || context.molarMassGPerMol !== undefined);
  const fitPressures = [
    ...new Set(
      measurementSets
        .filter((d) => d.kind === 'density')
        .flatMap((d) => d.rows.map((r) => r.pressureMPa).filter((p): p is number => p !== undefined)),
    ),
  ];
  const pressures =
    options.densityPressuresMPa ??
    (fitPressures.length
      ? [Math.min(...fitPressures), median(fitPressures), Math.max(...fitPressures)].filter((p, i, a) => a.indexOf(p) === i)
      : [1, 10, 50]);
  const candidates = options.candidates ?? defaultCandidates(fit, kinds, pressures);
  const uncertaintyOf = (kind: FitKind) => options.typicalUncertainty?.[kind] ?? typicalUncertaintyFromData(measurementSets, kind);
  const suggestions: Suggestion[] = [];
  for (const cand of candidates) {
    const model = PROPERTY_MODELS[cand.kind];
    let p;
    try {
      p = model.evaluate(cand, fit.epsilonK, fit.sigmaAngstrom, context);
    } catch {
      continue;
    }
    const typical = uncertaintyOf(cand.kind);
    const u = Math.max(typical.floor, typical.relative * Math.abs(p.value));
    if (!(u > 0) || !Number.isFinite(p.value)) continue;
    const g = [p.dEpsilonK, p.dSigmaAngstrom];
    let quad = 0;
    for (const a of free) for (const b of free) quad += g[a] * c[a][b] * g[b];
    const ratio = 1 / (1 + quad / (u * u));
    const where = cand.pressureMPa !== undefined ? `${cand.temperatureK} K and ${cand.pressureMPa} MPa` : `${cand.temperatureK} K`;
    const area = 100 * (1 - Math.sqrt(ratio));
    suggestions.push({
      ...cand,
      unit: model.unit,
      predicted: p.value,
      typicalUncertainty: u,
      determinantRatio: ratio,
      determinantDecreasePercent: 100 * (1 - ratio),
      areaDecreasePercent: area,
      text: `${KIND_WORDS[cand.kind] ?? `a ${model.label}`} at ${where} (expected ${p.value.toPrecision(4)} ± ${u.toPrecision(2)} ${model.unit}) would make the joint 95 % region ${area.toFixed(0)} % smaller.`,
    });
  }
  suggestions.sort((x, y) => x.determinantRatio - y.determinantRatio);
  return suggestions.slice(0, options.top ?? 5);
}

/**
 * Combining rules for Lennard-Jones 12-6 cross parameters (ε_ij, σ_ij) from the pure-species parameters.
 * ε is handled as ε/k_B in K and σ in Å; every rule here is homogeneous of degree 1 in ε and in σ, so the
 * result does not depend on the units as long as both species use the same ones.
 *
 * Cross parameters from any rule are estimates, not fitted values: the note in `mixtureTable` says so and
 * every export repeats it.
 */

export const COMBINING_RULES = ['lorentz-berthelot', 'kong', 'waldman-hagler'] as const;
export type CombiningRule = (typeof COMBINING_RULES)[number];

export interface LjParameters {
  epsilonK: number;
  sigmaAngstrom: number;
}

export interface CombiningRuleInfo {
  id: CombiningRule;
  name: string;
  /** The formulas in plain text, as written in exported comments. */
  formulas: string;
  reference: string;
}

export const COMBINING_RULE_INFO: Record<CombiningRule, CombiningRuleInfo> = {
  'lorentz-berthelot': {
    id: 'lorentz-berthelot',
    name: 'Lorentz–Berthelot',
    formulas: 'sigma_ij = (sigma_i + sigma_j)/2; epsilon_ij = sqrt(epsilon_i * epsilon_j)',
    reference: 'H. A. Lorentz, Ann. Phys. 248, 127 (1881); D. Berthelot, C. R. Acad. Sci. 126, 1703 (1898)',
  },
  kong: {
    id: 'kong',
    name: 'Kong',
    formulas:
      'epsilon_ij*sigma_ij^6 = sqrt(epsilon_i*sigma_i^6 * epsilon_j*sigma_j^6); ' +
      'epsilon_ij*sigma_ij^12 = [((epsilon_i*sigma_i^12)^(1/13) + (epsilon_j*sigma_j^12)^(1/13))/2]^13',
    reference: 'C. L. Kong, J. Chem. Phys. 59, 2464 (1973), Table I',
  },
  'waldman-hagler': {
    id: 'waldman-hagler',
    name: 'Waldman–Hagler',
    formulas:
      'sigma_ij = ((sigma_i^6 + sigma_j^6)/2)^(1/6); ' +
      'epsilon_ij = 2*sqrt(epsilon_i*epsilon_j) * sigma_i^3*sigma_j^3 / (sigma_i^6 + sigma_j^6)',
    reference: 'M. Waldman and A. T. Hagler, J. Comput. Chem. 14, 1077 (1993)',
  },
};

export function isCombiningRule(value: unknown): value is CombiningRule {
  return typeof value === 'string' && (COMBINING_RULES as readonly string[]).includes(value);
}

function assertParameters(p: LjParameters, which: string): void {
  if (!Number.isFinite(p.epsilonK) || p.epsilonK <= 0)
    throw new RangeError(`${which}: epsilonK must be a finite number above 0 (got ${p.epsilonK})`);
  if (!Number.isFinite(p.sigmaAngstrom) || p.sigmaAngstrom <= 0)
    throw new RangeError(`${which}: sigmaAngstrom must be a finite number above 0 (got ${p.sigmaAngstrom})`);
}

/**
 * Lorentz (1881) arithmetic mean of σ, Berthelot (1898) geometric mean of ε; formulas as given in the
 * GROMACS reference manual, "Parameter files", combination rule 2.
 */
function lorentzBerthelot(a: LjParameters, b: LjParameters): LjParameters {
  return { epsilonK: Math.sqrt(a.epsilonK * b.epsilonK), sigmaAngstrom: (a.sigmaAngstrom + b.sigmaAngstrom) / 2 };
}

/**
 * Kong (1973), Table I: the dispersion coefficient 4εσ⁶ is combined geometrically and the repulsion
 * coefficient 4εσ¹² by the 1/13-power mean, written here in the symmetric form
 * (εσ¹²)_ij = [((εσ¹²)_i^(1/13) + (εσ¹²)_j^(1/13))/2]^13, which equals Kong's
 * (ε_iσ_i¹²/2¹³)[1 + (ε_jσ_j¹²/ε_iσ_i¹²)^(1/13)]^13.
 * Formula form checked against SklogWiki "Combining rules" (Kong rules, Table I of Kong 1973); the symmetric
 * rewrite is ours.
 */
function kong(a: LjParameters, b: LjParameters): LjParameters {
  // Work relative to species a so that σ¹² (≈10⁶–10⁸ Å¹²) never meets a 13th power in raw form.
  const sigmaRatio = b.sigmaAngstrom / a.sigmaAngstrom;
  const epsRatio = b.epsilonK / a.epsilonK;
  // Dispersion part in units of ε_a σ_a⁶, repulsion part in units of ε_a σ_a¹².
  const c6 = Math.sqrt(epsRatio * sigmaRatio ** 6);
  const c12 = ((1 + (epsRatio * sigmaRatio ** 12) ** (1 / 13)) / 2) ** 13;
  const sigma6 = c12 / c6; // σ_ij⁶ / σ_a⁶
  return { epsilonK: (a.epsilonK * (c6 * c6)) / c12, sigmaAngstrom: a.sigmaAngstrom * sigma6 ** (1 / 6) };
}

/**
 * Waldman & Hagler (1993): sixth-power mean of σ and an ε that keeps the dispersion coefficient εσ⁶ at the
 * geometric mean. For the 12-6 form this is the same as LAMMPS `pair_modify mix sixthpower`
 * (https://docs.lammps.org/pair_modify.html).
 */
function waldmanHagler(a: LjParameters, b: LjParameters): LjParameters {
  const s6a = a.sigmaAngstrom ** 6;
  const s6b = b.sigmaAngstrom ** 6;
  const sum = s6a + s6b;
  return {
    epsilonK: (2 * Math.sqrt(a.epsilonK * b.epsilonK) * a.sigmaAngstrom ** 3 * b.sigmaAngstrom ** 3) / sum,
    sigmaAngstrom: (sum / 2) ** (1 / 6),
  };
}

/** Cross parameters of species a and b by the given rule; ε/k_B in K, σ in Å. */
export function combine(rule: CombiningRule, a: LjParameters, b: LjParameters): LjParameters {
  assertParameters(a, 'first species');
  assertParameters(b, 'second species');
  switch (rule) {
    case 'lorentz-berthelot':
      return lorentzBerthelot(a, b);
    case 'kong':
      return kong(a, b);
    case 'waldman-hagler':
      return waldmanHagler(a, b);
    default:
      throw new RangeError(`unknown combining rule "${String(rule)}"; use one of ${COMBINING_RULES.join(', ')}`);
  }
}

export type PairKind = 'pure' | 'combining-rule-estimate' | 'fitted-pair-set';

/**
 * Cross parameters of an approved pair set (k_ij, optionally l_ij, fitted to B12 data with both pure sets fixed;
 * shared/mixing/cross-virial.ts), keyed by the two parameter-set ids.
 */
export interface FittedPair extends LjParameters {
  pairSetId: number;
  setIdA: number;
  setIdB: number;
  kij: number;
  kijStdErr: number | null;
  lij: number | null;
  epsilonStdErrK: number | null;
  sigmaStdErrAngstrom: number | null;
}

export interface MixturePair extends LjParameters {
  /** Indices into the input list, i ≤ j. */
  i: number;
  j: number;
  kind: PairKind;
  /** For kind 'fitted-pair-set': the pair set the values come from. */
  fitted?: FittedPair;
}

export interface MixtureTable {
  rule: CombiningRule;
  pairs: MixturePair[];
  note: string;
}

export function mixtureNote(rule: CombiningRule): string {
  const info = COMBINING_RULE_INFO[rule];
  return (
    `Cross parameters (i ≠ j) are ${info.name} combining-rule estimates (${info.reference}), not fitted to ` +
    'mixture data; only the pure-species parameters (i = j) come from approved fits.'
  );
}

/**
 * Every pair i ≤ j of the given species, in row order (1-1, 1-2, …, 1-n, 2-2, …). Pure pairs carry the
 * input values unchanged; cross pairs come from the rule.
 */
export function mixtureTable(
  sets: readonly (LjParameters & { id?: number; fittedPairs?: readonly FittedPair[] })[],
  rule: CombiningRule,
  fittedPairs?: readonly FittedPair[],
): MixtureTable {
  // Approved pair sets reach every exporter on the sets themselves (catalog.service attaches them), so no export
  // signature has to change; an explicit list wins.
  const fitted = fittedPairs ?? sets.flatMap((s) => s.fittedPairs ?? []);
  if (!isCombiningRule(rule)) throw new RangeError(`unknown combining rule "${String(rule)}"; use one of ${COMBINING_RULES.join(', ')}`);
  if (sets.length < 1) throw new RangeError('a mixture needs at least one species');
  sets.forEach((s, k) => assertParameters(s, `species ${k + 1}`));
  const pairs: MixturePair[] = [];
  for (let i = 0; i < sets.length; i++) {
    for (let j = i; j < sets.length; j++) {
      if (i === j) pairs.push({ i, j, kind: 'pure', epsilonK: sets[i].epsilonK, sigmaAngstrom: sets[i].sigmaAngstrom });
      else {
        const f = fitted.find(
          (p) => (p.setIdA === sets[i].id && p.setIdB === sets[j].id) || (p.setIdA === sets[j].id && p.setIdB === sets[i].id),
        );
        if (f) pairs.push({ i, j, kind: 'fitted-pair-set', epsilonK: f.epsilonK, sigmaAngstrom: f.sigmaAngstrom, fitted: f });
        else pairs.push({ i, j, kind: 'combining-rule-estimate', ...combine(rule, sets[i], sets[j]) });
      }
    }
  }
  const anyFitted = pairs.some((p) => p.kind === 'fitted-pair-set');
  const note = anyFitted
    ? `Cross pairs marked fitted come from approved pair sets: k_ij (and l_ij where fitted) in ε_ij = (1 − k_ij)√(ε_iε_j), σ_ij = (1 − l_ij)(σ_i + σ_j)/2 ` +
      `fitted to measured cross second virial coefficients B12 with both pure sets fixed. Other cross pairs are ${COMBINING_RULE_INFO[rule].name} ` +
      `combining-rule estimates (${COMBINING_RULE_INFO[rule].reference}), not fitted to mixture data.`
    : mixtureNote(rule);
  return { rule, pairs, note };
}

import { describe, expect, it } from 'vitest';
import { COMBINING_RULES, combine, mixtureTable, type CombiningRule, type LjParameters } from './combining-rules';
import { convertEpsilon, convertSigma } from '../physics/parameter-units';
import { COMBINING_RULE_CHECKS } from '../validation/checks/material-checks';
import { itPassesReferenceChecks } from '../validation/reference-check-tests';

// Argon and krypton LJ parameters from second-virial data: Ar ε/k_B = 119.8 K, σ = 3.405 Å;
// Kr ε/k_B = 171 K, σ = 3.60 Å (Hirschfelder, Curtiss & Bird 1954, Table I-A; from memory).
const argon: LjParameters = { epsilonK: 119.8, sigmaAngstrom: 3.405 };
const krypton: LjParameters = { epsilonK: 171, sigmaAngstrom: 3.6 };
// A strongly asymmetric pair (helium-like and xenon-like sizes) to make the rules disagree visibly.
const small: LjParameters = { epsilonK: 10.22, sigmaAngstrom: 2.556 };
const large: LjParameters = { epsilonK: 221, sigmaAngstrom: 4.1 };

describe('combine: identities every rule must satisfy', () => {
  for (const rule of COMBINING_RULES) {
    it(`${rule}: a species combined with itself gives itself`, () => {
      // Any combining rule must reproduce the like pair (SklogWiki "Combining rules", introduction; common practice).
      for (const s of [argon, krypton, small, large]) {
        const r = combine(rule, s, s);
        expect(r.epsilonK).toBeCloseTo(s.epsilonK, 10);
        expect(r.sigmaAngstrom).toBeCloseTo(s.sigmaAngstrom, 12);
      }
    });

    it(`${rule}: symmetric in the two species`, () => {
      const ab = combine(rule, small, large);
      const ba = combine(rule, large, small);
      expect(ab.epsilonK).toBeCloseTo(ba.epsilonK, 10);
      expect(ab.sigmaAngstrom).toBeCloseTo(ba.sigmaAngstrom, 12);
    });

    it(`${rule}: result lies between the pure values`, () => {
      // All three rules are means of σ; ε_ij ≤ max ε (Kong 1973 and Waldman–Hagler 1993 give ε_ij ≤ Berthelot's).
      const r = combine(rule, argon, krypton);
      expect(r.sigmaAngstrom).toBeGreaterThan(argon.sigmaAngstrom);
      expect(r.sigmaAngstrom).toBeLessThan(krypton.sigmaAngstrom);
      expect(r.epsilonK).toBeGreaterThan(argon.epsilonK);
      expect(r.epsilonK).toBeLessThan(krypton.epsilonK);
    });

    it(`${rule}: combining in other units then converting back gives the same result`, () => {
      // Unit consistency: each rule is homogeneous of degree 1 in ε and σ.
      const inK = combine(rule, small, large);
      const toKcal = (p: LjParameters): LjParameters => ({
        epsilonK: convertEpsilon(p.epsilonK, 'kcal/mol'),
        sigmaAngstrom: convertSigma(p.sigmaAngstrom, 'nm'),
      });
      const inKcal = combine(rule, toKcal(small), toKcal(large));
      expect(inKcal.epsilonK / convertEpsilon(1, 'kcal/mol')).toBeCloseTo(inK.epsilonK, 9);
      expect(inKcal.sigmaAngstrom / convertSigma(1, 'nm')).toBeCloseTo(inK.sigmaAngstrom, 12);
    });
  }
});

describe('combine: Lorentz–Berthelot', () => {
  // Argon–krypton worked example: σ_12 = (3.405 + 3.60)/2 = 3.5025 Å, ε_12 = √(119.8·171) = 143.13 K (worked by hand,
  // rule as in the GROMACS reference manual, "Parameter files", combination rule 2): registry entries.
  itPassesReferenceChecks(COMBINING_RULE_CHECKS.filter((c) => c.id.startsWith('combining.lorentz-berthelot.')));
});

describe('combine: Waldman–Hagler', () => {
  // The LAMMPS pair_modify "mix sixthpower" formulas (LAMMPS documentation):
  //   epsilon_ij = (2 * sqrt(epsilon_i*epsilon_j) * sigma_i^3 * sigma_j^3) / (sigma_i^6 + sigma_j^6)
  //   sigma_ij = ((sigma_i**6 + sigma_j**6) / 2) ^ (1/6)
  // registry entries combining.waldman-hagler.*.
  itPassesReferenceChecks(COMBINING_RULE_CHECKS.filter((c) => c.id.startsWith('combining.waldman-hagler.')));

  it('keeps the dispersion coefficient εσ⁶ at the geometric mean', () => {
    // Waldman & Hagler (1993) build ε_ij so that the C6 term is the geometric mean of the pure ones.
    const r = combine('waldman-hagler', small, large);
    const c6 = r.epsilonK * r.sigmaAngstrom ** 6;
    expect(c6 / Math.sqrt(small.epsilonK * small.sigmaAngstrom ** 6 * large.epsilonK * large.sigmaAngstrom ** 6)).toBeCloseTo(1, 12);
  });

  it('gives a larger σ and a shallower well than Lorentz–Berthelot for unequal sizes', () => {
    // Power-mean inequality (M6 ≥ M1) and 2xy ≤ x² + y²; the direction matches Waldman & Hagler's (1993)
    // observation that Lorentz–Berthelot overestimates the well depth of unlike pairs.
    const wh = combine('waldman-hagler', small, large);
    const lb = combine('lorentz-berthelot', small, large);
    expect(wh.sigmaAngstrom).toBeGreaterThan(lb.sigmaAngstrom);
    expect(wh.epsilonK).toBeLessThan(lb.epsilonK);
  });
});

describe('combine: Kong', () => {
  // εσ⁶ at the geometric mean and εσ¹² at the 1/13-power mean (Kong 1973, Table I, LJ 12-6 rules, as reproduced on
  // SklogWiki, "Combining rules"), and the equal-size case worked by hand: registry entries combining.kong.*.
  itPassesReferenceChecks(COMBINING_RULE_CHECKS.filter((c) => c.id.startsWith('combining.kong.')));

  it('reduces to the 1/13-power mean of ε when the sizes are equal', () => {
    // With σ_i = σ_j = σ the Kong rules give σ_ij⁶ = σ⁶·M13/G and ε_ij = G²/M13 with G = √(ε_iε_j) and
    // M13 = ((ε_i^(1/13) + ε_j^(1/13))/2)^13 (algebra on Kong 1973, Table I; no published number).
    const a = { epsilonK: 100, sigmaAngstrom: 3.5 };
    const b = { epsilonK: 200, sigmaAngstrom: 3.5 };
    const g = Math.sqrt(100 * 200);
    const m13 = ((100 ** (1 / 13) + 200 ** (1 / 13)) / 2) ** 13;
    const r = combine('kong', a, b);
    expect(r.epsilonK).toBeCloseTo((g * g) / m13, 9);
    expect(r.sigmaAngstrom).toBeCloseTo(3.5 * (m13 / g) ** (1 / 6), 12);
    // Numbers for this case, by hand with logarithms: 100^(1/13) = 1.42510, 200^(1/13) = 1.50317,
    // M13 = 1.464135^13 = 142.07 K, G = 141.42 K, so ε_ij = 20000/142.07 ≈ 140.77 K and σ_ij ≈ 3.5027 Å
    // (registry entries combining.kong.equal-size.*, run above).
  });

  it('differs from Lorentz–Berthelot for unequal species', () => {
    const k = combine('kong', small, large);
    const lb = combine('lorentz-berthelot', small, large);
    expect(Math.abs(k.epsilonK - lb.epsilonK) / lb.epsilonK).toBeGreaterThan(0.05);
  });
});

describe('combine: input checks', () => {
  it('refuses non-positive or non-finite parameters and unknown rules', () => {
    expect(() => combine('kong', { epsilonK: 0, sigmaAngstrom: 3 }, argon)).toThrow(
      'first species: epsilonK must be a finite number above 0 (got 0)',
    );
    expect(() => combine('kong', argon, { epsilonK: 100, sigmaAngstrom: Number.NaN })).toThrow(
      'second species: sigmaAngstrom must be a finite number above 0 (got NaN)',
    );
    expect(() => combine('geometric' as CombiningRule, argon, krypton)).toThrow(
      'unknown combining rule "geometric"; use one of lorentz-berthelot, kong, waldman-hagler',
    );
  });
});

describe('mixtureTable', () => {
  it('lists every pair i ≤ j with pure pairs unchanged and cross pairs flagged as estimates', () => {
    const t = mixtureTable([argon, krypton, large], 'waldman-hagler');
    expect(t.pairs.map((p) => `${p.i}-${p.j}`)).toEqual(['0-0', '0-1', '0-2', '1-1', '1-2', '2-2']);
    expect(t.pairs.filter((p) => p.kind === 'pure').map((p) => p.i)).toEqual([0, 1, 2]);
    expect(t.pairs[0]).toMatchObject({ kind: 'pure', epsilonK: 119.8, sigmaAngstrom: 3.405 });
    expect(t.pairs[1]).toMatchObject({ kind: 'combining-rule-estimate', ...combine('waldman-hagler', argon, krypton) });
    expect(t.note).toContain('not fitted');
    expect(t.note).toContain('Waldman–Hagler');
  });

  it('needs at least one species and a known rule', () => {
    expect(() => mixtureTable([], 'kong')).toThrow('a mixture needs at least one species');
    expect(() => mixtureTable([argon], 'x' as CombiningRule)).toThrow('unknown combining rule "x"');
    expect(() => mixtureTable([argon, { epsilonK: -1, sigmaAngstrom: 3 }], 'kong')).toThrow('species 2: epsilonK');
  });
});

/**
 * LAMMPS input fragments (pair_style lj/cut) for a parameter set or a mixture, in `units real`
 * (ε in kcal/mol, distances in Å, mass in g/mol), `units metal` (ε in eV, Å, g/mol) or `units lj`
 * (reduced: ε, σ and the mass of type 1 are the units; the fragment states what they are in SI).
 * Keywords checked against the LAMMPS documentation:
 *   units        https://docs.lammps.org/units.html   (real: kcal/mol with the thermochemical calorie, Å; metal: eV, Å)
 *   pair lj/cut  https://docs.lammps.org/pair_lj.html  (pair_style lj/cut <rc>; pair_coeff i j ε σ [rc])
 *   pair_modify  https://docs.lammps.org/pair_modify.html (shift yes: energy zero at rc; tail yes: long-range
 *                energy and pressure corrections; explicit pair_coeff i j overrides mixing)
 * The fragment goes after the box exists (read_data or create_box); the units command is given as a
 * comment because it must come before the box is created.
 */
import type { ExportableParameterSet } from './exportable-parameter-set';
import { COMBINING_RULE_INFO, mixtureTable, type CombiningRule } from '../mixing/combining-rules';
import { convertEpsilon } from '../physics/parameter-units';
import { ANGSTROM_M, ATOMIC_MASS_KG, BOLTZMANN_J_PER_K } from '../physics/constants';
import {
  CAUTION_TEXT,
  FULL_POTENTIAL_SUGGESTED_CUTOFF_SIGMA,
  SCHEME_DESCRIPTION,
  approvalText,
  asciiText,
  commentBlock,
  commonValidity,
  engineNumber,
  isMie,
  mixtureCutoff,
  setHeaderLines,
  substanceLabel,
  validityOf,
  validityText,
} from './export-common';
import type { CutoffScheme } from '../physics/cutoff-schemes';

export type LammpsUnits = 'real' | 'metal';

const ENERGY_UNIT = { real: 'kcal/mol', metal: 'eV' } as const;

function unitsLines(units: LammpsUnits): string[] {
  return [
    `Target: LAMMPS units ${units} (energy ${ENERGY_UNIT[units]}, distance Angstrom, mass g/mol); https://docs.lammps.org/units.html`,
    `Put the command units ${units} before the box is created; paste the commands below after read_data/create_box.`,
  ];
}

function schemeCommentLines(scheme: CutoffScheme, cutoffSigma: number): string[] {
  switch (scheme) {
    case 'full-potential':
      return [
        'Cutoff treatment: these parameters describe the FULL potential (fitted without a cutoff).',
        `Recommended: a long cutoff (here ${engineNumber(cutoffSigma, 6)} sigma) with analytic tail corrections (pair_modify tail yes);`,
        'lengthen the cutoff if the box allows. Do not shift the potential. https://docs.lammps.org/pair_modify.html',
      ];
    case 'truncated-tail':
      return [
        `Cutoff treatment: truncated at rc = ${engineNumber(cutoffSigma, 6)} sigma with tail corrections, as fitted (pair_modify tail yes).`,
        'https://docs.lammps.org/pair_modify.html',
      ];
    case 'truncated-shifted':
      return [
        `Cutoff treatment: truncated at rc = ${engineNumber(cutoffSigma, 6)} sigma and shifted to zero there, as fitted (pair_modify shift yes, no tail).`,
        'https://docs.lammps.org/pair_modify.html',
      ];
  }
}

function modifyLine(scheme: CutoffScheme): string {
  return scheme === 'truncated-shifted' ? 'pair_modify shift yes tail no' : 'pair_modify shift no tail yes';
}

/** Fragment for one set as atom type 1. */
export function lammpsParameterSet(set: ExportableParameterSet, units: LammpsUnits): string {
  const cutoffSigma = set.scheme === 'full-potential' ? FULL_POTENTIAL_SUGGESTED_CUTOFF_SIGMA : (set.cutoffSigma as number);
  const rcAngstrom = cutoffSigma * set.sigmaAngstrom;
  const eps = convertEpsilon(set.epsilonK, ENERGY_UNIT[units]);
  const lines = [
    ...commentBlock('#', [
      ...setHeaderLines(set),
      '',
      ...unitsLines(units),
      `epsilon = ${engineNumber(eps)} ${ENERGY_UNIT[units]} (from epsilon/k_B = ${engineNumber(set.epsilonK)} K), sigma = ${engineNumber(set.sigmaAngstrom)} Angstrom, rc = ${engineNumber(rcAngstrom)} Angstrom`,
      ...schemeCommentLines(set.scheme, cutoffSigma),
    ]),
    `mass 1 ${engineNumber(set.substance.molarMassGPerMol)}`,
    // A Mie set uses LAMMPS's own Mie form (https://docs.lammps.org/pair_mie.html: pair_coeff i j ε σ γrep γatt).
    isMie(set) ? `pair_style mie/cut ${engineNumber(rcAngstrom)}` : `pair_style lj/cut ${engineNumber(rcAngstrom)}`,
    `pair_coeff 1 1 ${engineNumber(eps)} ${engineNumber(set.sigmaAngstrom)}${isMie(set) ? ` ${engineNumber(set.repulsiveExponent as number)} 6` : ''}`,
    modifyLine(set.scheme),
  ];
  return lines.join('\n') + '\n';
}

/**
 * Fragment for a mixture: atom types 1…n in the order given, every pair written explicitly with its own
 * cutoff rc_ij = (rc/σ)·σ_ij so each pair keeps the reduced cutoff its parameters were fitted for.
 */
export function lammpsMixture(sets: readonly ExportableParameterSet[], rule: CombiningRule, units: LammpsUnits): string {
  const table = mixtureTable(sets, rule);
  const cut = mixtureCutoff(sets);
  const info = COMBINING_RULE_INFO[rule];
  const common = commonValidity(sets);
  const rcMax = Math.max(...table.pairs.map((p) => cut.cutoffSigma * p.sigmaAngstrom));
  const header: string[] = [
    `Epsigma mixture of ${sets.length} parameter sets, cross pairs by the ${info.name} combining rule`,
    `Rule: ${info.formulas} (${info.reference})`,
    `NOTE: ${table.note}`,
    ...sets.map(
      (s, k) =>
        `Type ${k + 1}: ${substanceLabel(s)}, parameter set ${s.id} v${s.version}, ${approvalText(s)}; valid for ${validityText(validityOf(s))}; fitted for ${SCHEME_DESCRIPTION[s.scheme]}${s.cutoffSigma != null ? ` (rc = ${engineNumber(s.cutoffSigma, 6)} sigma)` : ''}`,
    ),
    common
      ? `All components valid together for: ${validityText(common)}`
      : 'WARNING: the validity ranges of the components do not overlap.',
    ...(cut.warning ? [cut.warning] : []),
    `CAUTION: ${CAUTION_TEXT}`,
    '',
    ...unitsLines(units),
    ...schemeCommentLines(cut.scheme, cut.cutoffSigma),
    'Every pair is set explicitly, so pair_modify mix has no effect on these pairs.',
  ];
  const lines = [
    ...commentBlock('#', header),
    ...sets.map((s, k) => `mass ${k + 1} ${engineNumber(s.substance.molarMassGPerMol)}`),
    `pair_style lj/cut ${engineNumber(rcMax)}`,
    ...table.pairs.map((p) => {
      const eps = convertEpsilon(p.epsilonK, ENERGY_UNIT[units]);
      const what =
        p.kind === 'pure'
          ? `pure, set ${sets[p.i].id} v${sets[p.i].version}`
          : p.fitted
            ? `fitted pair set ${p.fitted.pairSetId}, k_ij = ${engineNumber(p.fitted.kij, 5)}`
            : `${asciiText(info.name)} estimate, not fitted`;
      return `pair_coeff ${p.i + 1} ${p.j + 1} ${engineNumber(eps)} ${engineNumber(p.sigmaAngstrom)} ${engineNumber(cut.cutoffSigma * p.sigmaAngstrom)} # ${what}`;
    }),
    modifyLine(cut.scheme),
  ];
  return lines.join('\n') + '\n';
}

/**
 * LAMMPS `units lj`: every quantity in units of type 1's ε, σ and mass (https://docs.lammps.org/units.html:
 * energy ε, distance σ, mass m, time τ = σ√(m/ε), temperature ε/k_B, pressure ε/σ³, density m/σ³). The
 * comments state those scales in SI and lab units so reduced results can be turned back into physical ones.
 */
function ljScaleLines(reference: ExportableParameterSet): string[] {
  const epsJ = reference.epsilonK * BOLTZMANN_J_PER_K;
  const sigmaM = reference.sigmaAngstrom * ANGSTROM_M;
  const massKg = reference.substance.molarMassGPerMol * ATOMIC_MASS_KG;
  const tauS = sigmaM * Math.sqrt(massKg / epsJ);
  const pressureMPa = epsJ / sigmaM ** 3 / 1e6;
  const densityKgPerM3 = massKg / sigmaM ** 3;
  return [
    'Target: LAMMPS units lj (reduced); https://docs.lammps.org/units.html',
    'Put the command units lj before the box is created; paste the commands below after read_data/create_box.',
    `Reduced scales (type 1, ${asciiText(reference.substance.name)}):`,
    `  energy  epsilon = ${engineNumber(reference.epsilonK)} K x k_B = ${engineNumber(epsJ)} J = ${engineNumber(convertEpsilon(reference.epsilonK, 'kJ/mol'))} kJ/mol = ${engineNumber(convertEpsilon(reference.epsilonK, 'kcal/mol'))} kcal/mol`,
    `  length  sigma = ${engineNumber(reference.sigmaAngstrom)} Angstrom = ${engineNumber(sigmaM)} m`,
    `  mass    m = ${engineNumber(reference.substance.molarMassGPerMol)} g/mol = ${engineNumber(massKg)} kg`,
    `  time    tau = sigma sqrt(m/epsilon) = ${engineNumber(tauS)} s = ${engineNumber(tauS * 1e12)} ps`,
    `  temperature T = T* x ${engineNumber(reference.epsilonK)} K;  pressure P = P* x ${engineNumber(pressureMPa)} MPa;  density rho = rho* x ${engineNumber(densityKgPerM3)} kg/m3`,
  ];
}

/** Fragment for one set in `units lj`: ε = σ = m = 1, the cutoff in units of σ. */
export function lammpsLjParameterSet(set: ExportableParameterSet): string {
  const cutoffSigma = set.scheme === 'full-potential' ? FULL_POTENTIAL_SUGGESTED_CUTOFF_SIGMA : (set.cutoffSigma as number);
  const lines = [
    ...commentBlock('#', [
      ...setHeaderLines(set),
      '',
      ...ljScaleLines(set),
      `In these units epsilon = 1, sigma = 1, mass = 1, rc = ${engineNumber(cutoffSigma, 6)} (sigma).`,
      ...schemeCommentLines(set.scheme, cutoffSigma),
    ]),
    'mass 1 1.0',
    isMie(set) ? `pair_style mie/cut ${engineNumber(cutoffSigma, 8)}` : `pair_style lj/cut ${engineNumber(cutoffSigma, 8)}`,
    isMie(set) ? `pair_coeff 1 1 1.0 1.0 ${engineNumber(set.repulsiveExponent as number)} 6` : 'pair_coeff 1 1 1.0 1.0',
    modifyLine(set.scheme),
  ];
  return lines.join('\n') + '\n';
}

/** Mixture in `units lj`: type 1's ε, σ and mass are the units; every pair explicit with rc_ij = (rc/σ)·σ_ij. */
export function lammpsLjMixture(sets: readonly ExportableParameterSet[], rule: CombiningRule): string {
  const table = mixtureTable(sets, rule);
  const cut = mixtureCutoff(sets);
  const info = COMBINING_RULE_INFO[rule];
  const common = commonValidity(sets);
  const ref = sets[0];
  const e = (epsilonK: number) => epsilonK / ref.epsilonK;
  const l = (sigmaAngstrom: number) => sigmaAngstrom / ref.sigmaAngstrom;
  const rcMax = Math.max(...table.pairs.map((p) => cut.cutoffSigma * l(p.sigmaAngstrom)));
  const header: string[] = [
    `Epsigma mixture of ${sets.length} parameter sets, cross pairs by the ${info.name} combining rule`,
    `Rule: ${info.formulas} (${info.reference})`,
    `NOTE: ${table.note}`,
    ...sets.map(
      (s, k) =>
        `Type ${k + 1}: ${substanceLabel(s)}, parameter set ${s.id} v${s.version}, ${approvalText(s)}; valid for ${validityText(validityOf(s))}; fitted for ${SCHEME_DESCRIPTION[s.scheme]}${s.cutoffSigma != null ? ` (rc = ${engineNumber(s.cutoffSigma, 6)} sigma)` : ''}`,
    ),
    common
      ? `All components valid together for: ${validityText(common)}`
      : 'WARNING: the validity ranges of the components do not overlap.',
    ...(cut.warning ? [cut.warning] : []),
    `CAUTION: ${CAUTION_TEXT}`,
    '',
    ...ljScaleLines(ref),
    'Every epsilon, sigma and mass below is divided by those of type 1.',
    ...schemeCommentLines(cut.scheme, cut.cutoffSigma),
    'Every pair is set explicitly, so pair_modify mix has no effect on these pairs.',
  ];
  const lines = [
    ...commentBlock('#', header),
    ...sets.map((s, k) => `mass ${k + 1} ${engineNumber(s.substance.molarMassGPerMol / ref.substance.molarMassGPerMol, 12)}`),
    `pair_style lj/cut ${engineNumber(rcMax, 12)}`,
    ...table.pairs.map((p) => {
      const what =
        p.kind === 'pure'
          ? `pure, set ${sets[p.i].id} v${sets[p.i].version}`
          : p.fitted
            ? `fitted pair set ${p.fitted.pairSetId}, k_ij = ${engineNumber(p.fitted.kij, 5)}`
            : `${asciiText(info.name)} estimate, not fitted`;
      // Ratios to type 1 carry 12 digits so the reduced pair energies match the real-unit ones to rounding.
      return `pair_coeff ${p.i + 1} ${p.j + 1} ${engineNumber(e(p.epsilonK), 12)} ${engineNumber(l(p.sigmaAngstrom), 12)} ${engineNumber(cut.cutoffSigma * l(p.sigmaAngstrom), 12)} # ${what}`;
    }),
    modifyLine(cut.scheme),
  ];
  return lines.join('\n') + '\n';
}

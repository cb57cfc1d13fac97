/**
 * GROMACS topology fragments: an [ atomtypes ] line per set (σ in nm, ε in kJ/mol, ptype A) and, for a
 * mixture, a [ nonbond_params ] section with every cross pair, plus the matching .mdp settings as comments.
 * Checked against the GROMACS documentation:
 *   reference manual, "Parameter files" (https://manual.gromacs.org/current/reference-manual/topologies/parameter-files.html):
 *     with combination rule 2 or 3 in [ defaults ], V = σ (nm) and W = ε (kJ/mol) in [ atomtypes ] and
 *     [ nonbond_params ]; pairs given in [ nonbond_params ] override the combination rule;
 *   user guide, ".mdp options" (https://manual.gromacs.org/current/user-guide/mdp-options.html):
 *     vdwtype = Cut-off, rvdw [nm], vdw-modifier = Potential-shift | None, DispCorr = no | EnerPres.
 * The six-column atomtypes form "name mass charge ptype V W" (no atomic number, no bonded type) is the one
 * grompp recognises by a single-letter ptype in the fourth field (GROMACS source, toppush.cpp, push_at).
 */
import type { ExportableParameterSet } from './exportable-parameter-set';
import { COMBINING_RULE_INFO, mixtureTable, type CombiningRule } from '../mixing/combining-rules';
import { convertEpsilon, convertSigma } from '../physics/parameter-units';
import {
  CAUTION_TEXT,
  FULL_POTENTIAL_SUGGESTED_CUTOFF_SIGMA,
  SCHEME_DESCRIPTION,
  approvalText,
  commentBlock,
  commonValidity,
  engineNumber,
  mixtureCutoff,
  setHeaderLines,
  substanceLabel,
  validityOf,
  validityText,
} from './export-common';
import type { CutoffScheme } from '../physics/cutoff-schemes';

const MDP_URL = 'https://manual.gromacs.org/current/user-guide/mdp-options.html';
const TOP_URL = 'https://manual.gromacs.org/current/reference-manual/topologies/parameter-files.html';

/**
 * Atom type name: ASCII letters and digits of the formula (or name), starting with a letter, plus the set
 * id so that two versions of one substance never collide: "Ar_ps12".
 */
export function gromacsTypeName(set: ExportableParameterSet): string {
  const base = (set.substance.formula || set.substance.name)
    .normalize('NFKD')
    .replace(/[^A-Za-z0-9]/g, '')
    .slice(0, 12);
  const start = /^[A-Za-z]/.test(base) ? base : `X${base}`;
  return `${start}_ps${set.id}`;
}

function defaultsLines(): string[] {
  return [
    'These lines need combination rule 2 (or 3) in the [ defaults ] of your topology, so that the two',
    `last columns are sigma (nm) and epsilon (kJ/mol); ${TOP_URL}`,
    'for example:  [ defaults ]',
    'nbfunc comb-rule gen-pairs fudgeLJ fudgeQQ',
    '1      2         no        1.0     1.0',
  ];
}

function mdpLines(scheme: CutoffScheme, rvdwNm: number, cutoffSigma: number, perPair: boolean): string[] {
  const where = perPair ? 'for the largest sigma_ij' : '';
  const head = [
    `Matching .mdp settings (${MDP_URL}):`,
    'cutoff-scheme = Verlet',
    'vdwtype       = Cut-off',
    `rvdw          = ${engineNumber(rvdwNm, 6)}`,
  ];
  const reduced = `${engineNumber(cutoffSigma, 6)} sigma${where ? ` ${where}` : ''}`;
  const onePerSystem = perPair
    ? ['GROMACS uses one rvdw for all pairs, so pairs with a smaller sigma_ij see a cutoff longer than that in units of their sigma.']
    : [];
  switch (scheme) {
    case 'full-potential':
      return [
        'Cutoff treatment: these parameters describe the FULL potential (fitted without a cutoff).',
        `Recommended: a long cutoff (here rvdw = ${reduced}) with long-range dispersion correction; lengthen it if the box allows.`,
        ...head,
        'vdw-modifier  = None',
        'DispCorr      = EnerPres',
        ...onePerSystem,
      ];
    case 'truncated-tail':
      return [
        `Cutoff treatment: truncated at rc = ${reduced} with tail (dispersion) corrections, as fitted.`,
        ...head,
        'vdw-modifier  = None',
        'DispCorr      = EnerPres',
        ...onePerSystem,
      ];
    case 'truncated-shifted':
      return [
        `Cutoff treatment: truncated at rc = ${reduced} and shifted to zero there, no tail corrections, as fitted.`,
        ...head,
        'vdw-modifier  = Potential-shift',
        'DispCorr      = no',
        ...onePerSystem,
      ];
  }
}

function atomtypeLine(set: ExportableParameterSet): string {
  const name = gromacsTypeName(set);
  const sigmaNm = convertSigma(set.sigmaAngstrom, 'nm');
  const epsKJ = convertEpsilon(set.epsilonK, 'kJ/mol');
  return ` ${name.padEnd(16)} ${engineNumber(set.substance.molarMassGPerMol).padStart(10)}  0.000  A  ${engineNumber(sigmaNm).padStart(12)}  ${engineNumber(epsKJ).padStart(12)}`;
}

const ATOMTYPES_HEADER = ['[ atomtypes ]', '; name              mass (g/mol)  charge ptype  sigma (nm)  epsilon (kJ/mol)'];

export function gromacsParameterSet(set: ExportableParameterSet): string {
  const cutoffSigma = set.scheme === 'full-potential' ? FULL_POTENTIAL_SUGGESTED_CUTOFF_SIGMA : (set.cutoffSigma as number);
  const rvdwNm = convertSigma(cutoffSigma * set.sigmaAngstrom, 'nm');
  const lines = [
    ...commentBlock(';', [
      ...setHeaderLines(set),
      '',
      `epsilon = ${engineNumber(convertEpsilon(set.epsilonK, 'kJ/mol'))} kJ/mol, sigma = ${engineNumber(convertSigma(set.sigmaAngstrom, 'nm'))} nm`,
      ...defaultsLines(),
    ]),
    ...ATOMTYPES_HEADER,
    atomtypeLine(set),
    '',
    ...commentBlock(';', mdpLines(set.scheme, rvdwNm, cutoffSigma, false)),
  ];
  return lines.join('\n') + '\n';
}

/**
 * Mixture: all atom types, then every cross pair in [ nonbond_params ] (func 1, σ_ij in nm, ε_ij in kJ/mol)
 * so the chosen rule, not the topology's combination rule, decides them. GROMACS has one rvdw for all
 * pairs, so it is set for the largest σ_ij; smaller pairs then see a longer reduced cutoff.
 */
export function gromacsMixture(sets: readonly ExportableParameterSet[], rule: CombiningRule): string {
  const table = mixtureTable(sets, rule);
  const cut = mixtureCutoff(sets);
  const info = COMBINING_RULE_INFO[rule];
  const common = commonValidity(sets);
  const rvdwNm = convertSigma(Math.max(...table.pairs.map((p) => cut.cutoffSigma * p.sigmaAngstrom)), 'nm');
  const header = [
    `Epsigma mixture of ${sets.length} parameter sets, cross pairs by the ${info.name} combining rule`,
    `Rule: ${info.formulas} (${info.reference})`,
    `NOTE: ${table.note}`,
    ...sets.map(
      (s) =>
        `${gromacsTypeName(s)}: ${substanceLabel(s)}, parameter set ${s.id} v${s.version}, ${approvalText(s)}; valid for ${validityText(validityOf(s))}; fitted for ${SCHEME_DESCRIPTION[s.scheme]}${s.cutoffSigma != null ? ` (rc = ${engineNumber(s.cutoffSigma, 6)} sigma)` : ''}`,
    ),
    common
      ? `All components valid together for: ${validityText(common)}`
      : 'WARNING: the validity ranges of the components do not overlap.',
    ...(cut.warning ? [cut.warning] : []),
    `CAUTION: ${CAUTION_TEXT}`,
    '',
    ...defaultsLines(),
  ];
  const cross = table.pairs.filter((p) => p.kind !== 'pure');
  const lines = [
    ...commentBlock(';', header),
    ...ATOMTYPES_HEADER,
    ...sets.map(atomtypeLine),
    '',
    ...commentBlock(';', [
      table.pairs.some((p) => p.kind === 'fitted-pair-set')
        ? `Cross pairs: fitted pair sets where marked (k_ij from B12 data), otherwise ${info.name} estimates, not fitted; they override the combination rule of [ defaults ].`
        : `Cross pairs: ${info.name} estimates, not fitted; they override the combination rule of [ defaults ].`,
      ...cross
        .filter((p) => p.fitted)
        .map(
          (p) =>
            `${gromacsTypeName(sets[p.i])}-${gromacsTypeName(sets[p.j])}: fitted pair set ${p.fitted!.pairSetId}, k_ij = ${engineNumber(p.fitted!.kij, 5)}`,
        ),
    ]),
    '[ nonbond_params ]',
    '; i                 j                 func  sigma (nm)    epsilon (kJ/mol)',
    ...cross.map(
      (p) =>
        ` ${gromacsTypeName(sets[p.i]).padEnd(17)} ${gromacsTypeName(sets[p.j]).padEnd(17)} 1  ${engineNumber(convertSigma(p.sigmaAngstrom, 'nm')).padStart(12)}  ${engineNumber(convertEpsilon(p.epsilonK, 'kJ/mol')).padStart(12)}`,
    ),
    '',
    ...commentBlock(';', mdpLines(cut.scheme, rvdwNm, cut.cutoffSigma, true)),
  ];
  return lines.join('\n') + '\n';
}

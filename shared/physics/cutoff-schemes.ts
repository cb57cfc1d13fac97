/**
 * The cutoff treatments of a pair potential: the one list and type (DEVELOPERS.md, Vocabulary). B2 and dilute-gas
 * viscosity see the whole pair potential, so parameters fitted to them are full-potential parameters unless the
 * modeller says otherwise; a simulation always cuts the potential off, so it runs one of the truncated schemes.
 */
export const CUTOFF_SCHEMES = ['full-potential', 'truncated-tail', 'truncated-shifted'] as const;
export type CutoffScheme = (typeof CUTOFF_SCHEMES)[number];

/** The schemes a molecular-dynamics run can use: every scheme but the full potential. */
export type SimulationCutoffScheme = Exclude<CutoffScheme, 'full-potential'>;
export const SIMULATION_CUTOFF_SCHEMES = CUTOFF_SCHEMES.filter(
  (s): s is SimulationCutoffScheme => s !== 'full-potential',
) as readonly SimulationCutoffScheme[] as readonly [SimulationCutoffScheme, ...SimulationCutoffScheme[]];

/** How the screens name each scheme. */
export const CUTOFF_SCHEME_LABELS: Record<CutoffScheme, string> = {
  'full-potential': 'Full potential',
  'truncated-tail': 'Truncated with tail corrections',
  'truncated-shifted': 'Truncated and shifted',
};

/**
 * The cutoff scheme a fit's parameters are meant for when the modeller names none. B2 and dilute-gas
 * viscosity see the whole pair potential; a fit with density data ran simulations and inherits their
 * cutoff treatment (its result records the engine settings as `mdSettings`).
 */
import { CUTOFF_SCHEMES, type CutoffScheme } from '../physics/cutoff-schemes';
import { CUTOFF_SIGMA_RANGE } from '../schemas/parameter-sets';

export interface SchemeOfFit {
  scheme: CutoffScheme;
  cutoffSigma: number | null;
  /** Set when the simulations' cutoff lies outside the range a parameter set accepts: the modeller must choose. */
  cutoffOutOfRange: boolean;
}

export function schemeOfFit(result: { mdSettings?: { scheme?: string; cutoff?: number } } | null | undefined): SchemeOfFit {
  const md = result?.mdSettings;
  const scheme = CUTOFF_SCHEMES.find((s) => s === md?.scheme);
  if (!scheme || scheme === 'full-potential' || md?.cutoff === undefined)
    return { scheme: 'full-potential', cutoffSigma: null, cutoffOutOfRange: false };
  return { scheme, cutoffSigma: md.cutoff, cutoffOutOfRange: md.cutoff < CUTOFF_SIGMA_RANGE.min || md.cutoff > CUTOFF_SIGMA_RANGE.max };
}

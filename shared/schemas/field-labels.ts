/**
 * How the forms label each request field, so a refusal names the field as the person saw it
 * ("Valid to (K): the upper temperature must be above the lower one") rather than by its API path.
 * Array indices are written `*`; a path with no entry falls back to its last part in plain words.
 */
export const FIELD_LABELS: Record<string, string> = {
  'validity.temperatureMinK': 'Valid from (K)',
  'validity.temperatureMaxK': 'Valid to (K)',
  'validity.pressureMinMPa': 'Pressure from (MPa)',
  'validity.pressureMaxMPa': 'Pressure to (MPa)',
  validity: 'Range of validity',
  rationale: 'Rationale',
  scheme: 'Cutoff scheme',
  cutoffSigma: 'Cutoff r_c (σ)',
  fitId: 'From fit',
  decision: 'Decision',
  comment: 'Review comment',
  reason: 'Reason',
  body: 'Comment',
  substanceId: 'Substance',
  measurementSets: 'Measurement sets',
  'measurementSets.*.id': 'Measurement set',
  'measurementSets.*.version': 'Version of the measurement set',
  'measurementSets.*.weight': 'Weight of the measurement set',
  'measurementSets.*.excludeRows': 'Rows left out',
  'measurementSets.*.excludeRows.*': 'Rows left out',
  'measurementSets.*.excludeReason': 'Reason for leaving rows out',
  fixed: 'Hold a parameter',
  'fixed.epsilonK': 'Hold ε/k_B (K)',
  'fixed.sigmaAngstrom': 'Hold σ (Å)',
  'options.bounds.epsilonK': 'ε/k_B bounds (K)',
  'options.bounds.sigmaAngstrom': 'σ bounds (Å)',
  'options.start.epsilonK': 'Starting ε/k_B (K)',
  'options.start.sigmaAngstrom': 'Starting σ (Å)',
  'options.restarts': 'Restarts from perturbed starts',
  'options.maxIterations': 'Iterations at most',
  'options.quantumCorrection': 'Quantum correction to B2',
  'options.model': 'Potential model',
  'options.repulsiveExponent': 'Repulsive exponent λr (held)',
  'options.fitRepulsiveExponent': 'Fit λr as a third parameter',
  'options.posterior': 'Sample the posterior',
  'options.posterior.samples': 'Steps per walker',
  'options.posterior.seed': 'Sampler seed',
  'options.posterior.prior': 'Gaussian prior from an approved set',
  'options.posterior.prior.parameterSetId': 'Gaussian prior from an approved set',
  'options.density.atoms': 'Atoms',
  'options.density.steps': 'MD steps per run',
  'options.density.cutoff': 'Cutoff rc/σ',
  'options.density.scheme': 'Scheme',
  atoms: 'Atoms',
  steps: 'MD steps',
  cutoff: 'Cutoff rc/σ',
  reducedTemperature: 'T*',
  reducedPressure: 'P*',
  epsilonK: 'ε/k_B (K)',
  sigmaAngstrom: 'σ (Å)',
  name: 'Name',
  email: 'E-mail',
  password: 'Password',
  currentPassword: 'Current password',
  newPassword: 'New password',
  roles: 'Roles',
  formula: 'Formula',
  description: 'Description',
  molarMassGPerMol: 'Molar mass (g/mol)',
  kind: 'Kind',
  source: 'Source (citation)',
  doi: 'DOI',
  method: 'Measurement method',
  notes: 'Notes',
  delimiter: 'Delimiter',
  decimalSeparator: 'Decimal separator',
  defaultRelativeUncertaintyPercent: 'Default relative uncertainty (%)',
  id: 'Number in the address',
};

/** The form label of a request field path such as `validity.temperatureMaxK` or `measurementSets.0.excludeRows.2`. */
export function fieldLabel(path: string): string {
  const pattern = path.replace(/\.\d+(?=\.|$)/g, '.*');
  const direct = FIELD_LABELS[pattern];
  const index = /^measurementSets\.(\d+)/.exec(path);
  const which = index ? ` (measurement set ${Number(index[1]) + 1} of the request)` : '';
  if (direct) return `${direct}${which}`;
  const last =
    pattern
      .split('.')
      .filter((p) => p !== '*')
      .pop() ?? path;
  if (FIELD_LABELS[last]) return `${FIELD_LABELS[last]}${which}`;
  // camelCase to words, as a last resort.
  const words = last.replace(/([a-z])([A-Z])/g, '$1 $2').toLowerCase();
  return `${words.charAt(0).toUpperCase()}${words.slice(1)}${which}`;
}

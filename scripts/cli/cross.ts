/**
 * `npm run -s cli -- cross --pure EPS_K,SIGMA_A[,U_EPS_K,U_SIGMA_A[,CORR]] --pure … --data b12.csv [--fit-lij] --json`
 * Fits k_ij in ε12 = (1 − k_ij)√(ε1ε2) (and l_ij in σ12 = (1 − l_ij)(σ1 + σ2)/2 with --fit-lij) to measured cross second
 * virial coefficients B12(T), with both pure sets held fixed; their standard errors (and ε–σ correlation), when given,
 * are carried into the result (shared/mixing/cross-virial.ts). The data file has headers such as `T (K)`, `B12 (cm3/mol)`,
 * `u(B12) (cm3/mol)`.
 * Prints { kij, kijStdErr, kijStdErrData, kijStdErrPure, lij, lijStdErr, epsilon12K, epsilon12KStdErr, sigma12Angstrom,
 * sigma12AngstromStdErr, chi2, dof, reducedChi2, chi2CombiningRule, residuals, method }.
 */
import { readFileSync } from 'node:fs';
import { parseMeasurementCsv } from '../../shared/measurements/parse-measurement-csv';
import type { B12Row as ParsedB12Row } from '../../shared/measurements/property-kinds';
import { fitCrossInteraction, type PureSetParameters } from '../../shared/mixing/cross-virial';
import { errorMessage, parseFlags, requiredFlag } from './_flags';

const USAGE = 'usage: cross --pure <ε/K>,<σ/Å>[,<u(ε)>,<u(σ)>[,<corr>]] --pure <ε/K>,<σ/Å>[,…] --data <b12.csv> [--fit-lij] --json';

function parsePure(raw: string, which: number): PureSetParameters {
  const parts = raw.split(',').map((p) => p.trim());
  const nums = parts.map((p) => (p === '' ? Number.NaN : Number(p)));
  const bad = () =>
    new Error(
      `--pure (set ${which}) must be "EPS_K,SIGMA_A" with optional ",U_EPS_K,U_SIGMA_A[,CORR]", all finite numbers (ε, σ, u > 0, |corr| ≤ 1), got "${raw}"`,
    );
  if (![2, 4, 5].includes(nums.length) || nums.some((n) => !Number.isFinite(n))) throw bad();
  const [epsilonK, sigmaAngstrom, ue, us, corr] = nums;
  if (!(epsilonK > 0) || !(sigmaAngstrom > 0)) throw bad();
  if (nums.length >= 4 && (!(ue > 0) || !(us > 0))) throw bad();
  if (nums.length === 5 && !(Math.abs(corr) <= 1)) throw bad();
  return {
    epsilonK,
    sigmaAngstrom,
    ...(nums.length >= 4 ? { stdErr: { epsilonK: ue, sigmaAngstrom: us } } : {}),
    ...(nums.length === 5 ? { correlation: corr } : {}),
  };
}

export async function run(argv: string[]): Promise<unknown> {
  const values = parseFlags(
    argv,
    { pure: { type: 'string', multiple: true }, data: { type: 'string' }, 'fit-lij': { type: 'boolean' }, json: { type: 'boolean' } },
    USAGE,
  );
  const pure = values.pure ?? [];
  if (pure.length !== 2) throw new Error(`give --pure exactly twice (one per substance), got ${pure.length}; ${USAGE}`);
  const [a, b] = pure.map((p, i) => parsePure(p, i + 1));
  const path = requiredFlag('data', values.data, USAGE);
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (err) {
    throw new Error(`cannot read --data ${path}: ${errorMessage(err)}`, { cause: err });
  }
  const parsed = parseMeasurementCsv(text, { kind: 'b12' });
  if (!parsed.ok) throw new Error(`${path}: ${parsed.problems.map((p) => p.message).join(' | ')}`);
  const rows = (parsed.rows as ParsedB12Row[]).map((r) => ({
    temperatureK: r.temperatureK,
    b12Cm3PerMol: r.b12Cm3PerMol,
    uB12Cm3PerMol: r.uB12Cm3PerMol,
  }));
  const r = fitCrossInteraction(a, b, rows, { fitLij: values['fit-lij'] ?? false });
  return {
    kij: r.kij,
    kijStdErr: r.kijStdErr,
    kijStdErrData: r.kijStdErrData,
    kijStdErrPure: r.kijStdErrPure,
    lij: r.lij,
    lijStdErr: r.lijStdErr,
    epsilon12K: r.epsilon12K,
    epsilon12KStdErr: r.epsilon12KStdErr,
    sigma12Angstrom: r.sigma12Angstrom,
    sigma12AngstromStdErr: r.sigma12AngstromStdErr,
    chi2: r.chi2,
    dof: r.dof,
    reducedChi2: r.reducedChi2,
    chi2CombiningRule: r.chi2CombiningRule,
    converged: r.converged,
    residuals: r.residuals,
    method: r.method,
  };
}

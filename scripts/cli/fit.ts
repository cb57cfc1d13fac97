/**
 * `npm run -s cli -- fit --data FILE.csv [--data FILE2.csv ...] [--molar-mass M] [--quantum] [--restarts N] --json`
 * Fits Lennard-Jones (ε/k_B, σ) to uploaded-format measurement CSVs (B2 and/or viscosity, one property per file;
 * headers such as "T (K),B2 (cm3/mol),u(B2) (cm3/mol)" or "T (K),eta (uPa s),u(eta) (uPa s)").
 * Prints { status, epsilonK, sigmaAngstrom, stdErr, correlation, chi2, dof, reducedChi2, convergence, warnings }.
 */
import { readFileSync } from 'node:fs';
import { parseArgs } from 'node:util';
import { fitLennardJones, type FitDataset } from '../../shared/fitting/lj-fit';
import { isFitKind } from '../../shared/fitting/property-models';
import { parseMeasurementCsv } from '../../shared/measurements/parse-measurement-csv';
import { rowValueAndUncertainty } from '../../shared/measurements/property-kinds';

const USAGE = 'usage: fit --data <file.csv> [--data <file2.csv> ...] [--molar-mass <g/mol>] [--quantum] [--restarts <n>] --json';

function positiveNumberFlag(name: string, raw: string | undefined): number | undefined {
  if (raw === undefined) return undefined;
  const value = Number(raw);
  if (raw.trim() === '' || !Number.isFinite(value) || value <= 0) throw new Error(`--${name} must be a positive number, got "${raw}"`);
  return value;
}

/** Reads one CSV through the shared upload parser; throws with every problem it reports. */
function loadDataset(path: string, molarMassGPerMol: number | undefined): FitDataset {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (err) {
    throw new Error(`cannot read --data ${path}: ${err instanceof Error ? err.message : String(err)}`);
  }
  const parsed = parseMeasurementCsv(text, molarMassGPerMol !== undefined ? { molarMassGPerMol } : {});
  if (!parsed.ok) {
    throw new Error(`${path}: ${parsed.problems.map((p) => p.message).join(' | ')}`);
  }
  const kind = parsed.kind;
  if (!isFitKind(kind)) throw new Error(`${path}: holds ${String(kind)} data, which the Lennard-Jones fit does not use yet (it fits b2 and viscosity)`);
  return {
    id: path,
    kind,
    label: path,
    rows: parsed.rows.map((row) => {
      const { value, uncertainty } = rowValueAndUncertainty(row);
      return { temperatureK: row.temperatureK, value, uncertainty };
    }),
  };
}

export async function run(argv: string[]): Promise<unknown> {
  let values: { data?: string[]; 'molar-mass'?: string; quantum?: boolean; restarts?: string; json?: boolean };
  try {
    ({ values } = parseArgs({
      args: argv,
      strict: true,
      allowPositionals: false,
      options: {
        data: { type: 'string', multiple: true },
        'molar-mass': { type: 'string' },
        quantum: { type: 'boolean' },
        restarts: { type: 'string' },
        json: { type: 'boolean' },
      },
    }));
  } catch (err) {
    throw new Error(`${err instanceof Error ? err.message : String(err)}; ${USAGE}`);
  }
  const files = values.data ?? [];
  if (files.length === 0) throw new Error(`missing required flag --data; ${USAGE}`);
  const molarMassGPerMol = positiveNumberFlag('molar-mass', values['molar-mass']);
  let restarts: number | undefined;
  if (values.restarts !== undefined) {
    restarts = Number(values.restarts);
    if (!Number.isInteger(restarts) || restarts < 0) throw new Error(`--restarts must be a non-negative integer, got "${values.restarts}"`);
  }
  const datasets = files.map((file) => loadDataset(file, molarMassGPerMol));
  if (values.quantum && molarMassGPerMol === undefined) throw new Error('--quantum needs --molar-mass (the quantum correction depends on the molecular mass)');
  if (datasets.some((d) => d.kind === 'viscosity') && molarMassGPerMol === undefined) {
    throw new Error('viscosity data need --molar-mass (the Chapman–Enskog viscosity depends on the molecular mass)');
  }
  const fit = fitLennardJones(datasets, { molarMassGPerMol, quantumCorrection: values.quantum ?? false, ...(restarts !== undefined ? { restarts } : {}) });
  return {
    status: fit.status,
    ...(fit.failureReason ? { failureReason: fit.failureReason } : {}),
    epsilonK: fit.epsilonK,
    sigmaAngstrom: fit.sigmaAngstrom,
    stdErr: fit.stdErr,
    correlation: fit.correlation,
    chi2: fit.chi2,
    dof: fit.dof,
    reducedChi2: fit.reducedChi2,
    convergence: fit.convergence,
    warnings: fit.warnings,
  };
}

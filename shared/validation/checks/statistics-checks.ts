/** Reference checks of the F and χ² distributions and of the least-squares solver on NIST StRD data sets. */
import { curveFitProblem, weightedLeastSquares, type CurveModel } from '../../fitting/least-squares';
import { chiSquareQuantile, fQuantile } from '../../fitting/statistics';
import { absolute, closeToDigits, relative, type ReferenceCheck } from '../reference-check';

const STATISTICS_TEST = 'shared/fitting/statistics.test.ts';
const LEAST_SQUARES_TEST = 'shared/fitting/least-squares.test.ts';
const CALIBRATION_TEST = 'shared/physics/md/npt-calibration.test.ts';

// Upper 5 % critical values F(ν1, ν2) with the decimals the table gives. Rows ν2 = 1..3: table "F Distribution" at
// atozmath.com/CONM/DistributionTables.aspx (4 decimals; retrieved with the search tool). Rows ν2 = 10, 12, 20:
// NIST/SEMATECH e-Handbook of Statistical Methods, §1.3.6.7.3 (3 decimals; from memory).
const F_TABLE: Array<[number, number, number, number]> = [
  [1, 1, 161.4476, 4],
  [2, 1, 199.5, 4],
  [1, 2, 18.5128, 4],
  [2, 2, 19.0, 4],
  [3, 2, 19.1643, 4],
  [10, 2, 19.3959, 4],
  [1, 3, 10.128, 4],
  [2, 3, 9.5521, 4],
  [10, 3, 8.7855, 4],
  [2, 10, 4.103, 3],
  [5, 10, 3.326, 3],
  [10, 10, 2.978, 3],
  [2, 12, 3.885, 3],
  [2, 20, 3.493, 3],
];

export interface DistributionCheck extends ReferenceCheck {
  degreesOfFreedom: number[];
}

export const STATISTICS_CHECKS: DistributionCheck[] = [
  ...F_TABLE.map(([d1, d2, value, decimals]): DistributionCheck => ({
    id: `statistics.f95.${d1}.${d2}`,
    area: 'Statistics distributions',
    quantity: 'upper 5 % point of the F distribution',
    unit: '1',
    state: `ν1 = ${d1}, ν2 = ${d2}`,
    source:
      d2 <= 3
        ? 'atozmath.com "F Distribution" table (retrieved with the search tool)'
        : 'NIST/SEMATECH e-Handbook §1.3.6.7.3 (from memory)',
    reference: value,
    // Half a unit of the table's last decimal: the table's rounding.
    tolerance: absolute(0.5 * 10 ** -decimals + 1e-9),
    testFile: STATISTICS_TEST,
    degreesOfFreedom: [d1, d2],
    compute: () => fQuantile(0.95, d1, d2),
  })),
  ...(
    [
      [1, 3.841],
      [2, 5.991],
      [10, 18.307],
      [30, 43.773],
    ] as const
  ).map(([dof, value]): DistributionCheck => ({
    id: `statistics.chi2-95.${dof}`,
    area: 'Statistics distributions',
    quantity: 'upper 5 % point of the χ² distribution',
    unit: '1',
    state: `ν = ${dof}`,
    source: 'NIST/SEMATECH e-Handbook §1.3.6.7.4 (from memory)',
    reference: value,
    tolerance: absolute(0.0005 + 1e-9),
    testFile: STATISTICS_TEST,
    degreesOfFreedom: [dof],
    compute: () => chiSquareQuantile(0.95, dof),
  })),
  ...(
    [
      [0.005, 6.844],
      [0.995, 38.582],
    ] as const
  ).map(([p, value]): DistributionCheck => ({
    id: `statistics.chi2-19.${p}`,
    area: 'Statistics distributions',
    quantity: `χ² quantile at probability ${p}`,
    unit: '1',
    state: 'ν = 19',
    source: 'NIST/SEMATECH e-Handbook, table 1.3.6.7.4 (from memory)',
    reference: value,
    tolerance: closeToDigits(3),
    testFile: CALIBRATION_TEST,
    degreesOfFreedom: [19],
    compute: () => chiSquareQuantile(p, 19),
  })),
];

/** y = b1·(1 − exp(−b2·x)), the model of both NIST data sets below. */
export const exponentialRise: CurveModel = (x, b) => {
  const e = Math.exp(-b[1] * x);
  return { value: b[0] * (1 - e), gradient: [1 - e, b[0] * x * e] };
};

// NIST StRD (Statistical Reference Data sets), Nonlinear Regression, Misra1a (lower difficulty; Misra, NIST 1978).
// Data, starting values and certified values as in the NIST file Misra1a.dat (retrieved with the search tool).
export const MISRA1A = {
  name: 'Misra1a',
  x: [77.6, 114.9, 141.1, 190.8, 239.9, 289.0, 332.8, 378.4, 434.8, 477.3, 536.8, 593.1, 689.1, 760.0],
  y: [10.07, 14.73, 17.94, 23.93, 29.61, 35.18, 40.02, 44.82, 50.76, 55.05, 61.01, 66.4, 75.47, 81.78],
  starts: [
    [500, 1e-4],
    [250, 5e-4],
  ],
  certified: [2.3894212918e2, 5.5015643181e-4],
  certifiedStdDev: [2.7070075241, 7.2668688436e-6],
  residualSumOfSquares: 1.2455138894e-1,
  dof: 12,
  source: 'NIST StRD Nonlinear Regression, Misra1a.dat, certified values (retrieved with the search tool)',
};

// NIST StRD (Statistical Reference Data sets), Nonlinear Regression, BoxBOD (higher difficulty; Box, Hunter & Hunter 1978,
// pp. 483–487). Values as in the NIST file BoxBOD.dat (retrieved with the search tool).
export const BOXBOD = {
  name: 'BoxBOD',
  x: [1, 2, 3, 5, 7, 10],
  y: [109, 149, 149, 191, 213, 224],
  starts: [
    [1, 1],
    [100, 0.75],
  ],
  certified: [2.1380940889e2, 5.4723748542e-1],
  certifiedStdDev: [1.2354515176e1, 1.0455993237e-1],
  residualSumOfSquares: 1.1680088766e3,
  dof: 4,
  source: 'NIST StRD Nonlinear Regression, BoxBOD.dat, certified values (retrieved with the search tool)',
};

export type StrdDataSet = typeof MISRA1A;

/** The fit the certified values are compared with: unit uncertainties, χ²/ν-scaled covariance (NIST's convention). */
export function fitStrd(set: StrdDataSet, start: number[]) {
  const problem = curveFitProblem({ x: set.x, y: set.y, uncertainty: set.x.map(() => 1) }, exponentialRise, ['b1', 'b2']);
  return weightedLeastSquares(problem, { initialParameters: start });
}

export interface StrdCheck extends ReferenceCheck {
  dataSet: StrdDataSet;
  startIndex: number;
}

// Parameters to 6+ and standard errors to 4+ significant digits; the residual sum of squares to 1e-8.
export const LEAST_SQUARES_CHECKS: StrdCheck[] = [MISRA1A, BOXBOD].flatMap((set) =>
  set.starts.flatMap((start, startIndex): StrdCheck[] => {
    const common = {
      area: 'Least squares (NIST StRD)' as const,
      source: set.source,
      testFile: LEAST_SQUARES_TEST,
      dataSet: set,
      startIndex,
    };
    const state = `${set.name}, start ${startIndex + 1} (b1 = ${start[0]}, b2 = ${start[1]})`;
    const prefix = `strd.${set.name.toLowerCase()}.start${startIndex + 1}`;
    return [
      ...[0, 1].map((k): StrdCheck => ({
        ...common,
        id: `${prefix}.b${k + 1}`,
        quantity: `certified b${k + 1}`,
        unit: '1',
        state,
        reference: set.certified[k],
        tolerance: relative(5e-7),
        compute: () => fitStrd(set, start).parameters[k],
      })),
      ...[0, 1].map((k): StrdCheck => ({
        ...common,
        id: `${prefix}.sd-b${k + 1}`,
        quantity: `certified standard deviation of b${k + 1}`,
        unit: '1',
        state,
        reference: set.certifiedStdDev[k],
        tolerance: relative(5e-5),
        compute: () => fitStrd(set, start).standardErrors![k],
      })),
      {
        ...common,
        id: `${prefix}.rss`,
        quantity: 'certified residual sum of squares',
        unit: '1',
        state,
        reference: set.residualSumOfSquares,
        tolerance: relative(1e-8),
        compute: () => fitStrd(set, start).chi2,
      },
    ];
  }),
);

/** Reference checks of B2, the quantum corrections to B2, B3 and B2 of Mie λr-6 potentials. */
import { deBoerParameter, quantumB2 } from '../../physics/quantum-b2';
import { reducedB3, reducedB3OfMayer } from '../../physics/third-virial';
import {
  b2WithGradient,
  b2ZeroCm3PerMol,
  boyleReducedTemperature,
  deBoerParameterSquared,
  reducedB2,
  reducedB2Derivative,
  reducedQuantumB2Coefficient,
} from '../../physics/virial';
import { hcbSeries, largest, quantumSeries } from '../independent-references';
import { absolute, closeToDigits, range, relative, type ReferenceCheck } from '../reference-check';

const VIRIAL_TEST = 'shared/physics/virial.test.ts';
const QUANTUM_TEST = 'shared/physics/quantum-b2.test.ts';
const B3_TEST = 'shared/physics/third-virial.test.ts';
const MIE_TEST = 'shared/physics/mie-potential.test.ts';

const SERIES_GRID = [0.3, 0.5, 0.7, 1, 1.5, 2, 2.5, 3, 4, 5, 7, 10, 20, 30, 50, 100, 1000];
const HCB_SERIES = 'Hirschfelder, Curtiss & Bird 1954, eq. 3.6-9 (exact series, coded independently with Γ from mathjs)';
const rel = (a: number, b: number) => Math.abs(a / b - 1);

export const B2_CHECKS: ReferenceCheck[] = [
  {
    id: 'b2.hcb-series.grid',
    area: 'B2',
    quantity: 'largest relative deviation of B2* from the exact series',
    unit: '1',
    state: `${SERIES_GRID.length} temperatures, 0.3 ≤ T* ≤ 1000`,
    source: HCB_SERIES,
    reference: 0,
    tolerance: absolute(1e-9),
    testFile: VIRIAL_TEST,
    compute: () => largest(SERIES_GRID, (t) => rel(reducedB2(t), hcbSeries(t).b2)),
  },
  {
    id: 'b2.hcb-series.boyle-region',
    area: 'B2',
    quantity: 'largest absolute deviation of B2* from the exact series (B2* ≈ 0 there)',
    unit: 'b0',
    state: 'T* = 3.3, 3.418, 3.5',
    source: HCB_SERIES,
    reference: 0,
    tolerance: absolute(1e-11),
    testFile: VIRIAL_TEST,
    compute: () => largest([3.3, 3.418, 3.5], (t) => reducedB2(t) - hcbSeries(t).b2),
  },
  {
    id: 'b2.hcb-series.derivative-grid',
    area: 'B2',
    quantity: 'largest relative deviation of dB2*/dT* from the term-by-term derivative of the series',
    unit: '1',
    state: '8 temperatures, 0.3 ≤ T* ≤ 100',
    source: HCB_SERIES,
    reference: 0,
    tolerance: absolute(1e-9),
    testFile: VIRIAL_TEST,
    compute: () => largest([0.3, 0.5, 1, 2, 3.418, 10, 25, 100], (t) => rel(reducedB2Derivative(t), hcbSeries(t).db2)),
  },
  {
    id: 'b2.hcb-table.t1',
    area: 'B2',
    quantity: 'B2*',
    unit: 'b0',
    state: 'T* = 1',
    source: 'Hirschfelder, Curtiss & Bird 1954, Table I-B (from memory)',
    reference: -2.538,
    tolerance: closeToDigits(3),
    testFile: VIRIAL_TEST,
    compute: () => reducedB2(1),
  },
  {
    id: 'b2.hcb-table.t0.3',
    area: 'B2',
    quantity: 'B2*',
    unit: 'b0',
    state: 'T* = 0.3',
    source: 'Hirschfelder, Curtiss & Bird 1954, Table I-B (from memory)',
    reference: -27.88,
    tolerance: closeToDigits(2),
    testFile: VIRIAL_TEST,
    compute: () => reducedB2(0.3),
  },
  {
    id: 'b2.boyle-temperature',
    area: 'B2',
    quantity: 'Boyle temperature T*_B (B2* = 0)',
    unit: 'ε/k_B',
    state: 'LJ 12-6',
    source: 'Hirschfelder, Curtiss & Bird 1954',
    reference: 3.418,
    tolerance: closeToDigits(3),
    testFile: VIRIAL_TEST,
    compute: () => boyleReducedTemperature(),
  },
  {
    id: 'b2.b0-per-cubic-angstrom',
    area: 'B2',
    quantity: 'b0 = 2πN_Aσ³/3 for σ = 1 Å',
    unit: 'cm³/mol',
    state: 'σ = 1 Å',
    source: 'N_A from CODATA 2018 (Tiesinga et al. 2021), hand computation',
    reference: 1.26127421,
    tolerance: closeToDigits(7),
    testFile: VIRIAL_TEST,
    compute: () => b2ZeroCm3PerMol(1),
  },
  {
    id: 'b2.argon-273',
    area: 'B2',
    quantity: 'B2 of argon (ε/k = 119.8 K, σ = 3.405 Å)',
    unit: 'cm³/mol',
    state: 'T = 273.15 K',
    source: 'measured −21.5 (from memory); Hirschfelder, Curtiss & Bird 1954 table gives ≈ −21',
    reference: -21.5,
    tolerance: range(-23, -19),
    testFile: VIRIAL_TEST,
    compute: () => b2WithGradient(273.15, 119.8, 3.405).b2Cm3PerMol,
  },
];

// LJ constants fitted to B2 (Hirschfelder, Curtiss & Bird 1954, Table I-A, from memory): ε/k_B in K, σ in Å, M in g/mol.
const HE = { name: 'He', epsilonK: 10.22, sigmaAngstrom: 2.556, molarMass: 4.0026 };
const H2 = { name: 'H2', epsilonK: 37.0, sigmaAngstrom: 2.928, molarMass: 2.016 };
const NE = { name: 'Ne', epsilonK: 35.6, sigmaAngstrom: 2.749, molarMass: 20.18 };
const AR = { name: 'Ar', epsilonK: 119.8, sigmaAngstrom: 3.405, molarMass: 39.948 };
const gasState = (g: typeof HE) => `${g.name}: ε/k = ${g.epsilonK} K, σ = ${g.sigmaAngstrom} Å, M = ${g.molarMass} g/mol`;

export const QUANTUM_B2_CHECKS: ReferenceCheck[] = [
  ...(
    [
      [HE, 2.67],
      [NE, 0.59],
    ] as const
  ).map(([g, value]): ReferenceCheck => ({
    id: `quantum.de-boer-squared.${g.name.toLowerCase()}`,
    area: 'Quantum B2',
    quantity: 'reduced de Boer parameter Λ* (from Λ*² of the Wigner–Kirkwood term)',
    unit: '1',
    state: gasState(g),
    source: 'de Boer 1948; Hirschfelder, Curtiss & Bird 1954, Table 6.4-1 (from memory)',
    reference: value,
    tolerance: absolute(0.01),
    testFile: VIRIAL_TEST,
    compute: () => Math.sqrt(deBoerParameterSquared(g.epsilonK, g.sigmaAngstrom, g.molarMass)),
  })),
  {
    id: 'quantum.wigner-kirkwood-series',
    area: 'Quantum B2',
    quantity: 'largest relative deviation of B_I* from an independent Γ-function series',
    unit: '1',
    state: 'T* = 0.5, 1, 2.5, 10, 100',
    source: 'series derived from the definition (no published table at hand: independent check)',
    reference: 0,
    tolerance: absolute(1e-9),
    testFile: VIRIAL_TEST,
    compute: () => largest([0.5, 1, 2.5, 10, 100], (t) => rel(reducedQuantumB2Coefficient(t), quantumSeries(t))),
  },
  ...(
    [
      [HE, 2.67],
      [H2, 1.73],
      [NE, 0.59],
      [AR, 0.19],
    ] as const
  ).map(([g, value]): ReferenceCheck => ({
    id: `quantum.de-boer.${g.name.toLowerCase()}`,
    area: 'Quantum B2',
    quantity: 'reduced de Boer parameter Λ*',
    unit: '1',
    state: gasState(g),
    source: 'de Boer, Physica 14 (1948) 139; Hirschfelder, Curtiss & Bird 1954, §6.5 (from memory)',
    reference: value,
    tolerance: relative(0.03),
    testFile: QUANTUM_TEST,
    compute: () => deBoerParameter(g.epsilonK, g.sigmaAngstrom, g.molarMass),
  })),
  // Normal hydrogen, experimental B2 (Dymond & Smith 1980, from memory); the test also asks that Feynman–Hibbs beats
  // the classical value at each temperature.
  ...(
    [
      [77.3, -11.3],
      [100, -2.0],
      [300, 14.8],
    ] as const
  ).map(([t, measured]): ReferenceCheck => ({
    id: `quantum.feynman-hibbs.h2.${t}`,
    area: 'Quantum B2',
    quantity: 'Feynman–Hibbs B2 of hydrogen (HCB constants)',
    unit: 'cm³/mol',
    state: `T = ${t} K`,
    source: 'Dymond & Smith, The Virial Coefficients of Pure Gases and Mixtures, 1980 (from memory)',
    reference: measured,
    tolerance: absolute(1.5),
    testFile: QUANTUM_TEST,
    compute: () => quantumB2(t, H2.epsilonK, H2.sigmaAngstrom, H2.molarMass).feynmanHibbsCm3PerMol,
  })),
  {
    id: 'quantum.feynman-hibbs.he.273',
    area: 'Quantum B2',
    quantity: 'Feynman–Hibbs B2 of helium (HCB constants)',
    unit: 'cm³/mol',
    state: 'T = 273.15 K',
    source: 'Dymond & Smith 1980 (from memory)',
    reference: 11.8,
    tolerance: absolute(0.6),
    testFile: QUANTUM_TEST,
    compute: () => quantumB2(273.15, HE.epsilonK, HE.sigmaAngstrom, HE.molarMass).feynmanHibbsCm3PerMol,
  },
];

const HCB_C_TABLE = 'Hirschfelder, Curtiss & Bird 1954, Appendix Table I-C (from memory)';
const B3_GRID = [1.1, 1.15, 1.2, 1.25, 1.3, 1.35, 1.4];
const b3Maximum = () => B3_GRID.map((t) => [t, reducedB3(t)] as const).reduce((a, b) => (b[1] > a[1] ? b : a));

export const B3_CHECKS: ReferenceCheck[] = [
  {
    id: 'b3.hard-sphere',
    area: 'B3',
    quantity: 'B3/b0² for hard spheres (f = −1 inside σ)',
    unit: 'b0²',
    state: 'hard spheres',
    source: 'exact: B3 = (5/8) b0² (Boltzmann 1899)',
    reference: 0.625,
    tolerance: closeToDigits(5),
    testFile: B3_TEST,
    compute: () =>
      reducedB3OfMayer(
        { f: (x) => (x < 1 ? -1 : 0) },
        { breakpoints: Array.from({ length: 41 }, (_, i) => i * 0.025), pointsPerPanel: 8 },
      )[0],
  },
  {
    id: 'b3.hcb-table.t1',
    area: 'B3',
    quantity: 'C*(T*) = B3/b0²',
    unit: 'b0²',
    state: 'T* = 1',
    source: HCB_C_TABLE,
    reference: 0.4297,
    tolerance: closeToDigits(3),
    testFile: B3_TEST,
    compute: () => reducedB3(1),
  },
  {
    id: 'b3.hcb-table.maximum',
    area: 'B3',
    quantity: 'largest C* on the grid T* = 1.1 … 1.4',
    unit: 'b0²',
    state: 'maximum of C*',
    source: `${HCB_C_TABLE}: peak ≈ 0.59–0.60 (reference: the middle)`,
    reference: 0.595,
    tolerance: range(0.585, 0.61),
    testFile: B3_TEST,
    compute: () => b3Maximum()[1],
  },
  {
    id: 'b3.hcb-table.maximum-position',
    area: 'B3',
    quantity: 'T* of the largest C* on the grid 1.1 … 1.4 (step 0.05)',
    unit: 'ε/k_B',
    state: 'maximum of C*',
    source: `${HCB_C_TABLE}: peak between T* = 1.2 and 1.3 (reference: the middle)`,
    reference: 1.25,
    tolerance: range(1.175, 1.325),
    testFile: B3_TEST,
    compute: () => b3Maximum()[0],
  },
];

// Reference B2*(T*) = B2/(2πN_Aσ³/3) of the Mie λr-6 potential and ∂B2*/∂λr, computed for the test by an independent
// quadrature: mpmath 1.3.0 (tanh-sinh `mp.quad`, 30 significant digits) of −3∫(e^{−u*/T*} − 1)x² dx over
// [0, 1, x_min, 2x_min, ∞], and `mp.diff` (numerical differentiation at 30 digits) for ∂/∂λr. Script:
//   C = (n/(n−6))(n/6)^(6/(n−6)); f = −3·expm1(−C(x^−n − x^−6)/T)·x²; mp.quad(f, [0, 1, xm, 2xm, inf])
// The 12-6 row agrees with Hirschfelder, Curtiss & Bird (1954), Table I-B (B2*(1) = −2.5381, B2*(5) = 0.2433; from memory).
/* eslint-disable no-loss-of-precision -- the reference values are kept digit for digit as the quadrature printed them */
export const MIE_B2_REFERENCE: Record<number, Array<[number, number, number]>> = {
  8: [
    [0.7, -7.014306456209609, 0.983401785026],
    [1, -3.978412894908942, 0.620667837508],
    [2, -1.284874654890129, 0.284193479369],
    [5, -0.03753485807233207, 0.117799959344],
    [20, 0.3969305795015096, 0.0464582818541],
  ],
  10: [
    [0.7, -5.56433621990935, 0.536263524904],
    [1, -3.068801863304489, 0.334352846611],
    [2, -0.8694619413187904, 0.152396673805],
    [5, 0.1375790010837311, 0.0655683105352],
    [20, 0.4721591633840856, 0.0308859531999],
  ],
  12: [
    [0.7, -4.71003731595488, 0.340852980797],
    [1, -2.538081336319327, 0.21099183253],
    [2, -0.6276252881164595, 0.0961632175673],
    [5, 0.2433435027746588, 0.0428302832089],
    [20, 0.5253742041723858, 0.0230527801207],
  ],
  16: [
    [0.7, -3.733545489394112, 0.175517477126],
    [1, -1.935978690794231, 0.107819331073],
    [2, -0.35273496946765, 0.0493597523963],
    [5, 0.3690790698466669, 0.0232598068018],
    [20, 0.59930897149292, 0.0149347420958],
  ],
  20: [
    [0.7, -3.183093971473268, 0.108118034656],
    [1, -1.598479475266587, 0.0661720080197],
    [2, -0.1978226980111982, 0.030466491162],
    [5, 0.4435651771925475, 0.01496308941],
    [20, 0.6497872639571895, 0.01068851346],
  ],
  36: [
    [0.7, -2.23877535162104, 0.0326399993242],
    [1, -1.021927859710587, 0.0198895920007],
    [2, 0.06965426795333967, 0.0093109514166],
    [5, 0.5805467691309264, 0.00497861594979],
    [20, 0.7571867737316787, 0.00424460229804],
  ],
};
/* eslint-enable no-loss-of-precision */
const MPMATH = 'independent 30-digit quadrature (mpmath 1.3.0 tanh-sinh mp.quad; mp.diff for ∂/∂λr), script in the test';

/** Mie B2 checks carry their λr and T* so the test can also check the dimensional path (b2WithGradient / b0). */
export interface MieB2Check extends ReferenceCheck {
  repulsiveExponent: number;
  reducedTemperature: number;
  kind: 'b2' | 'dB2dRepulsiveExponent';
}

export const MIE_B2_CHECKS: MieB2Check[] = Object.entries(MIE_B2_REFERENCE).flatMap(([nText, rows]) =>
  rows.flatMap(([tStar, b2Star, dB2dn]): MieB2Check[] => {
    const n = Number(nText);
    const common = {
      area: 'Mie B2' as const,
      unit: 'b0',
      state: `λr = ${n}, T* = ${tStar}`,
      source: MPMATH,
      testFile: MIE_TEST,
      repulsiveExponent: n,
      reducedTemperature: tStar,
    };
    return [
      {
        ...common,
        id: `mie-b2.${n}.t${tStar}`,
        kind: 'b2',
        quantity: 'B2*',
        reference: b2Star,
        tolerance: absolute(1e-11 * (1 + Math.abs(b2Star))),
        compute: () => reducedB2(tStar, n),
      },
      {
        ...common,
        id: `mie-b2.${n}.t${tStar}.d-lambda`,
        kind: 'dB2dRepulsiveExponent',
        quantity: '∂B2*/∂λr',
        reference: dB2dn,
        tolerance: absolute(1e-9 * (1 + Math.abs(dB2dn))),
        compute: () =>
          (b2WithGradient(tStar * 150, 150, 3.7, undefined, { repulsiveExponent: n, exponentDerivative: true })
            .dB2dRepulsiveExponent as number) / b2ZeroCm3PerMol(3.7),
      },
    ];
  }),
);

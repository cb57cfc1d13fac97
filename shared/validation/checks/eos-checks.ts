/** Reference checks of the three LJ equations of state (JZG 1993, Kolafa–Nezbeda 1994, Thol 2016), coexistence and freezing. */
import { freezingLiquidDensity, LJ_TRIPLE_POINT_TEMPERATURE } from '../../physics/eos/lj-freezing';
import { ljCriticalPoint } from '../../physics/eos/lj-eos-models';
import { knCriticalPoint, knDensity, knInternalEnergy, knPressure } from '../../physics/eos/kolafa-nezbeda-1994';
import { tholCoexistence, tholCriticalPoint } from '../../physics/eos/thol-2016';
import { ljEosCriticalPoint, ljEosDensity, ljEosInternalEnergy, ljEosPressure } from '../../physics/lj-eos';
import { absolute, closeToDigits, range, relative, type ReferenceCheck, type ValidationArea } from '../reference-check';

const JZG_TEST = 'shared/physics/lj-eos.test.ts';
const KN_TEST = 'shared/physics/eos/kolafa-nezbeda-1994.test.ts';
const THOL_TEST = 'shared/physics/eos/thol-2016.test.ts';
const FREEZING_TEST = 'shared/physics/eos/lj-freezing.test.ts';

// NIST Standard Reference Simulation Website, Lennard-Jones fluid, "MC: NVT Monte Carlo",
// https://mmlapps.nist.gov/srs/LJ_PURE/mc.htm (cut-off 3σ with analytic long-range corrections, which approximates
// the full potential the equations describe). Values: mean U*/N and P*.
export const NIST_SRSW_NVT_MC = {
  densities: [0.001, 0.003, 0.005, 0.007, 0.009, 0.776, 0.78, 0.82, 0.86, 0.9],
  byTemperature: {
    0.85: {
      energy: [-1.0317e-2, -3.1019e-2, -5.1901e-2, -7.2834e-2, -9.3973e-2, -5.5121, -5.5386, -5.7947, -6.0305, -6.2391],
      pressure: [8.4402e-4, 2.4965e-3, 4.1003e-3, 5.6565e-3, 7.1641e-3, 6.7714e-3, 4.7924e-2, 5.5355e-1, 1.266, 2.2314],
    },
    0.9: {
      energy: [-9.9165e-3, -2.9787e-2, -4.9771e-2, -6.9805e-2, -8.9936e-2, -5.4689, -5.4956, -5.7456, -5.9753, -6.1773],
      pressure: [8.9429e-4, 2.6485e-3, 4.3569e-3, 6.0193e-3, 7.6363e-3, 2.4056e-1, 2.7851e-1, 8.2386e-1, 1.5781, 2.5848],
    },
  } as Record<number, { energy: number[]; pressure: number[] }>,
};
const NIST_MC = 'NIST SRSW, LJ fluid, NVT Monte Carlo (rc = 3σ + long-range corrections), mmlapps.nist.gov/srs/LJ_PURE/mc.htm';

/** Checks carry their state so a test can name it. */
export interface EosStateCheck extends ReferenceCheck {
  reducedTemperature: number;
  reducedDensity: number;
}

/**
 * Pressure and energy of an equation against the NIST table. Dilute states (ρ* < 0.1): 0.1 % in P*, 1 % in U*; liquid
 * states: the equation's stated accuracy, an absolute tolerance in P* and a relative one in U*.
 */
function nistChecks(
  prefix: string,
  area: ValidationArea,
  testFile: string,
  pressure: (rho: number, t: number) => number,
  energy: (rho: number, t: number) => number,
  liquid: { pressureAbsolute: number; energyRelative: number },
): EosStateCheck[] {
  return Object.entries(NIST_SRSW_NVT_MC.byTemperature).flatMap(([tText, data]) =>
    NIST_SRSW_NVT_MC.densities.flatMap((rho, i): EosStateCheck[] => {
      const t = Number(tText);
      const dilute = rho < 0.1;
      const common = { area, state: `T* = ${t}, ρ* = ${rho}`, source: NIST_MC, testFile, reducedTemperature: t, reducedDensity: rho };
      return [
        {
          ...common,
          id: `${prefix}.nist-mc.p.t${t}.rho${rho}`,
          quantity: 'P*',
          unit: 'ε/σ³',
          reference: data.pressure[i],
          tolerance: dilute ? relative(1e-3) : absolute(liquid.pressureAbsolute),
          compute: () => pressure(rho, t),
        },
        {
          ...common,
          id: `${prefix}.nist-mc.u.t${t}.rho${rho}`,
          quantity: 'U*/N',
          unit: 'ε',
          reference: data.energy[i],
          tolerance: relative(dilute ? 1e-2 : liquid.energyRelative),
          compute: () => energy(rho, t),
        },
      ];
    }),
  );
}

const JZG_PAPER = 'Johnson, Zollweg & Gubbins 1993, Mol. Phys. 78, 591, abstract and Section 5 (from memory)';

export const JZG_CHECKS: ReferenceCheck[] = [
  {
    id: 'jzg.critical.t',
    area: 'EOS: JZG 1993',
    quantity: 'T*c',
    unit: 'ε/k_B',
    state: 'critical point',
    source: JZG_PAPER,
    reference: 1.313,
    tolerance: absolute(5e-4),
    testFile: JZG_TEST,
    compute: () => ljEosCriticalPoint().reducedTemperature,
  },
  {
    id: 'jzg.critical.rho',
    area: 'EOS: JZG 1993',
    quantity: 'ρ*c',
    unit: 'σ⁻³',
    state: 'critical point',
    source: JZG_PAPER,
    reference: 0.31,
    tolerance: absolute(5e-4),
    testFile: JZG_TEST,
    compute: () => ljEosCriticalPoint().reducedDensity,
  },
  {
    id: 'jzg.critical.p',
    area: 'EOS: JZG 1993',
    quantity: 'P*c',
    unit: 'ε/σ³',
    state: 'critical point',
    source: JZG_PAPER,
    reference: 0.13,
    tolerance: absolute(5e-3),
    testFile: JZG_TEST,
    compute: () => ljEosCriticalPoint().reducedPressure,
  },
  {
    id: 'jzg.liquid-density.t1.p0.1',
    area: 'EOS: JZG 1993',
    quantity: 'liquid ρ* (saturated liquid ≈ 0.70, slightly compressed)',
    unit: 'σ⁻³',
    state: 'T* = 1.0, P* = 0.1',
    source: 'NIST SRSW SAT-TMMC, rc = 3σ + LRC (from memory)',
    reference: 0.7,
    tolerance: range(0.7, 0.73),
    testFile: JZG_TEST,
    compute: () => ljEosDensity(1.0, 0.1).reducedDensity,
  },
  // JZG fitted their own full-potential MD data with rms deviations of order 0.01–0.02 in P* at liquid densities and
  // below 1 % in U* (JZG 1993, Section 4, from memory); the NIST runs truncate at 3σ and add a mean-field tail.
  ...nistChecks('jzg', 'EOS: JZG 1993', JZG_TEST, ljEosPressure, ljEosInternalEnergy, { pressureAbsolute: 0.015, energyRelative: 5e-3 }),
];

const KN_PAPER = 'Kolafa & Nezbeda 1994 (from memory); NIST teqp test suite, src/tests/catch_test_LJ126.cxx';

export const KOLAFA_NEZBEDA_CHECKS: ReferenceCheck[] = [
  {
    id: 'kn.critical.t',
    area: 'EOS: Kolafa–Nezbeda 1994',
    quantity: 'T*c',
    unit: 'ε/k_B',
    state: 'critical point',
    source: KN_PAPER,
    reference: 1.3396478,
    tolerance: absolute(2e-5),
    testFile: KN_TEST,
    compute: () => knCriticalPoint().reducedTemperature,
  },
  {
    id: 'kn.critical.rho',
    area: 'EOS: Kolafa–Nezbeda 1994',
    quantity: 'ρ*c',
    unit: 'σ⁻³',
    state: 'critical point',
    source: KN_PAPER,
    reference: 0.3108039,
    tolerance: absolute(5e-4),
    testFile: KN_TEST,
    compute: () => knCriticalPoint().reducedDensity,
  },
  {
    id: 'kn.critical.p',
    area: 'EOS: Kolafa–Nezbeda 1994',
    quantity: 'P*c',
    unit: 'ε/σ³',
    state: 'critical point',
    source: 'Kolafa & Nezbeda 1994 (from memory)',
    reference: 0.1405,
    tolerance: absolute(1e-4),
    testFile: KN_TEST,
    compute: () => knCriticalPoint().reducedPressure,
  },
  {
    id: 'kn.b2.t0.8',
    area: 'EOS: Kolafa–Nezbeda 1994',
    quantity: 'B2 from the dilute limit of the equation',
    unit: 'σ³',
    state: 'T* = 0.8, ρ* = 1e-8',
    source: 'NIST teqp test suite ("Check virial coefficients")',
    reference: -7.821026827,
    tolerance: absolute(5e-4),
    testFile: KN_TEST,
    compute: () => (knPressure(1e-8, 0.8) / (1e-8 * 0.8) - 1) / 1e-8,
  },
  {
    id: 'kn.liquid-density.t0.85.p0.1',
    area: 'EOS: Kolafa–Nezbeda 1994',
    quantity: 'liquid ρ*',
    unit: 'σ⁻³',
    state: 'T* = 0.85, P* = 0.1',
    source: `${NIST_MC}: P* = 0.0479 at ρ* = 0.78 and 0.554 at 0.82, linear interpolation 0.7842`,
    reference: 0.7842,
    tolerance: range(0.78, 0.79),
    testFile: KN_TEST,
    compute: () => knDensity(0.85, 0.1, { phase: 'liquid' }).reducedDensity,
  },
  // KN report deviations from their simulation data of about 0.01–0.02 in P* in the dense liquid and a few thousandths
  // in U*/N (KN 1994, section 5, from memory).
  ...nistChecks('kn', 'EOS: Kolafa–Nezbeda 1994', KN_TEST, knPressure, knInternalEnergy, { pressureAbsolute: 0.02, energyRelative: 3e-3 }),
];

const THOL_PAPER = 'Thol et al., J. Phys. Chem. Ref. Data 45, 023101 (2016): critical point of their equation';
const NIST_TMMC = 'NIST SRSW, LJ fluid, TMMC vapour–liquid coexistence, rc = 3σ + LRC (from memory)';

export const THOL_CHECKS: ReferenceCheck[] = [
  {
    id: 'thol.critical.t',
    area: 'EOS: Thol 2016',
    quantity: 'T*c',
    unit: 'ε/k_B',
    state: 'critical point',
    source: THOL_PAPER,
    reference: 1.32,
    tolerance: closeToDigits(3),
    testFile: THOL_TEST,
    compute: () => tholCriticalPoint().reducedTemperature,
  },
  {
    id: 'thol.critical.rho',
    area: 'EOS: Thol 2016',
    quantity: 'ρ*c',
    unit: 'σ⁻³',
    state: 'critical point',
    source: THOL_PAPER,
    reference: 0.31,
    tolerance: absolute(0.006),
    testFile: THOL_TEST,
    compute: () => tholCriticalPoint().reducedDensity,
  },
  {
    id: 'thol.critical.p',
    area: 'EOS: Thol 2016',
    quantity: 'P*c',
    unit: 'ε/σ³',
    state: 'critical point',
    source: THOL_PAPER,
    reference: 0.13,
    tolerance: closeToDigits(2),
    testFile: THOL_TEST,
    compute: () => tholCriticalPoint().reducedPressure,
  },
];

export const COEXISTENCE_CHECKS: ReferenceCheck[] = [
  {
    id: 'coexistence.thol.t0.7.liquid',
    area: 'Coexistence and freezing',
    quantity: 'saturated liquid ρ* (Thol 2016)',
    unit: 'σ⁻³',
    state: 'T* = 0.70',
    source: NIST_TMMC,
    reference: 0.8437,
    tolerance: relative(0.004),
    testFile: THOL_TEST,
    compute: () => tholCoexistence(0.7).liquidDensity,
  },
  {
    id: 'coexistence.thol.t0.7.vapour',
    area: 'Coexistence and freezing',
    quantity: 'saturated vapour ρ* (Thol 2016)',
    unit: 'σ⁻³',
    state: 'T* = 0.70',
    source: NIST_TMMC,
    reference: 1.996e-3,
    tolerance: relative(0.03),
    testFile: THOL_TEST,
    compute: () => tholCoexistence(0.7).vapourDensity,
  },
  {
    id: 'coexistence.thol.t0.7.pressure',
    area: 'Coexistence and freezing',
    quantity: 'saturation pressure P* (Thol 2016)',
    unit: 'ε/σ³',
    state: 'T* = 0.70',
    source: NIST_TMMC,
    reference: 1.37e-3,
    tolerance: relative(0.03),
    testFile: THOL_TEST,
    compute: () => tholCoexistence(0.7).saturationPressure,
  },
  {
    id: 'coexistence.thol.t1.liquid',
    area: 'Coexistence and freezing',
    quantity: 'saturated liquid ρ* (Thol 2016)',
    unit: 'σ⁻³',
    state: 'T* = 1.0',
    source: `${NIST_TMMC}: ≈ 0.70`,
    reference: 0.7,
    tolerance: range(0.695, 0.71),
    testFile: THOL_TEST,
    compute: () => tholCoexistence(1.0).liquidDensity,
  },
  {
    id: 'coexistence.thol.t1.pressure',
    area: 'Coexistence and freezing',
    quantity: 'saturation pressure P* (Thol 2016)',
    unit: 'ε/σ³',
    state: 'T* = 1.0',
    source: `${NIST_TMMC}: ≈ 0.025`,
    reference: 0.025,
    tolerance: relative(0.04),
    testFile: THOL_TEST,
    compute: () => tholCoexistence(1.0).saturationPressure,
  },
  {
    id: 'coexistence.selector.jzg-critical-t',
    area: 'Coexistence and freezing',
    quantity: 'T*c of the JZG equation through the selector',
    unit: 'ε/k_B',
    state: 'critical point',
    source: 'Johnson, Zollweg & Gubbins 1993 (from memory)',
    reference: 1.313,
    tolerance: closeToDigits(3),
    testFile: THOL_TEST,
    compute: () => ljCriticalPoint('jzg1993').reducedTemperature,
  },
  {
    id: 'coexistence.selector.kn-critical-t',
    area: 'Coexistence and freezing',
    quantity: 'T*c of the Kolafa–Nezbeda equation through the selector',
    unit: 'ε/k_B',
    state: 'critical point',
    source: 'Kolafa & Nezbeda 1994 (from memory)',
    reference: 1.34,
    tolerance: absolute(0.01),
    testFile: THOL_TEST,
    compute: () => ljCriticalPoint('kn1994').reducedTemperature,
  },
  {
    id: 'freezing.triple-point-liquid',
    area: 'Coexistence and freezing',
    quantity: 'liquid density at freezing (Mastny & de Pablo 2007, eq. 21)',
    unit: 'σ⁻³',
    state: `triple point, T* = ${LJ_TRIPLE_POINT_TEMPERATURE}`,
    source: 'Agrawal & Kofke 1995, Mol. Phys. 85, 43, and Mastny & de Pablo 2007 (from memory)',
    reference: 0.845,
    tolerance: absolute(0.005),
    testFile: FREEZING_TEST,
    compute: () => freezingLiquidDensity(LJ_TRIPLE_POINT_TEMPERATURE),
  },
];

/**
 * Reference checks of the Mie λr-6 transport cross-sections behind the Mie collision integrals and viscosity, against an
 * independent classical quadrature (scripts/reference/mie-cross-sections.py: scipy 1.17.1 QUADPACK with its own
 * substitution and end-point weight, sharing no code with shared/physics/mie-collision-integrals.ts). No published
 * table of Mie λr-6 collision integrals was at hand, so the independent quadrature is the reference.
 */
import { mieTransportCrossSections } from '../../physics/mie-collision-integrals';
import { relative, type ReferenceCheck } from '../reference-check';

const MIE_COLLISION_TEST = 'shared/physics/mie-collision-integrals.test.ts';
const SCIPY = 'independent classical quadrature (scipy 1.17.1 QUADPACK; scripts/reference/mie-cross-sections.py, run 2026-12-02)';

// [λr, E*, Q(1)*, Q(2)*] from the script above; 1 for rigid spheres of diameter σ. λr = 12 checks the script against the
// 12-6 code, the others the Mie code. Orbiting (E* below 0.59 for λr = 8, 0.94 for 16, 1.13 for 24) in four rows.
const SCIPY_CROSS_SECTIONS: Array<[number, number, number, number]> = [
  [12, 1.0, 2.3993325186708643, 2.8191632532383846],
  [8, 0.3, 4.717579758190946, 5.290118585232216],
  [8, 3.0, 1.1897964905937204, 1.685360645610888],
  [16, 0.5, 2.7670677715273233, 3.2449983046650335],
  [16, 5.0, 1.0140301648782584, 1.2359248763713773],
  [20, 1.2, 1.920020562885521, 2.2907917045605646],
  [24, 0.2, 3.3744165676223976, 3.9698536342111392],
  [36, 2.0, 1.395749942291673, 1.803117048486468],
  [36, 50.0, 0.8449200819180966, 0.9070210578073908],
];

/** Observed agreement is below 1e-8; the tolerance leaves room for the scipy side's own 1e-8 error requests. */
export const MIE_CROSS_SECTION_CHECKS: ReferenceCheck[] = SCIPY_CROSS_SECTIONS.flatMap(([n, e, q1, q2]): ReferenceCheck[] =>
  (
    [
      ['1', q1],
      ['2', q2],
    ] as const
  ).map(([l, reference]) => ({
    id: `collision.mie.q${l}.n${n}.e${e}`,
    area: 'Collision integrals',
    quantity: `Mie ${n}-6 transport cross-section Q(${l})*`,
    unit: '1',
    state: `λr = ${n}, E* = ${e}`,
    source: SCIPY,
    reference,
    tolerance: relative(1e-7),
    testFile: MIE_COLLISION_TEST,
    compute: () => (l === '1' ? mieTransportCrossSections(e, n).q1 : mieTransportCrossSections(e, n).q2),
  })),
);

import { describe, expect, it } from 'vitest';
import { runNpt } from './npt';
import { ljEosDensity } from '../lj-eos';
import { NPT_EOS_STATES } from '../../validation/checks/md-checks';

// NPT densities against the Johnson, Zollweg & Gubbins 1993 MBWR equation of state (Mol. Phys. 78, 591;
// ../lj-eos.ts), which fits full-potential LJ simulation data. Tolerance: 3 standard errors of the run + 0.5 %
// (the EOS's own accuracy and the rc = 2.5 tail-correction approximation, g(r) = 1 beyond rc).
// The states are listed in the validation registry (shared/validation/checks/md-checks.ts) as run in the test suite only.
const STATES = NPT_EOS_STATES;

describe('runNpt densities vs the JZG 1993 equation of state', () => {
  for (const [t, p, label] of STATES) {
    it(`T* = ${t}, P* = ${p} (${label})`, () => {
      const r = runNpt({ reducedTemperature: t, reducedPressure: p, atoms: 500, steps: 12000, seed: 3 });
      const eos = ljEosDensity(t, p).reducedDensity;
      expect(r.phase).toBe('fluid');
      expect(Math.abs(r.reducedDensity - eos)).toBeLessThan(3 * r.stdErr + 0.005 * eos);
      // The barostat holds the requested pressure: mean virial pressure within 3 standard errors + 1 %.
      expect(Math.abs(r.diagnostics.meanPressure - p)).toBeLessThan(3 * r.diagnostics.meanPressureStdErr + 0.01 * p);
      expect(r.stdErr / r.reducedDensity).toBeLessThan(0.005);
    });
  }
});

import { describe, expect, it } from 'vitest';
import { runNpt } from './npt';
import { ljEosDensity } from '../lj-eos';

describe('NPT fluctuation formulas', () => {
  it('match the derivatives of the JZG 1993 EOS and give the isobaric volume variance (T* = 1.0, P* = 1.0)', () => {
    // References: Johnson, Zollweg & Gubbins 1993 EOS (../lj-eos.ts): (∂ρ/∂T)_P = −(∂P/∂T)_ρ/(∂P/∂ρ)_T and
    // (∂ρ/∂P)_T = 1/(∂P/∂ρ)_T at the EOS density. Fluctuation estimates have ~10 % statistical error here and the
    // rc = 2.5 model differs slightly from the full potential: tolerance 3 standard errors + 10 % of the EOS value.
    const r = runNpt({ reducedTemperature: 1.0, reducedPressure: 1.0, atoms: 500, steps: 40000, seed: 8 });
    const eos = ljEosDensity(1.0, 1.0);
    expect(Math.abs(r.dRhoDP - eos.dRhoDP)).toBeLessThan(3 * r.dRhoDPStdErr + 0.1 * Math.abs(eos.dRhoDP));
    expect(Math.abs(r.dRhoDT - eos.dRhoDT)).toBeLessThan(3 * r.dRhoDTStdErr + 0.1 * Math.abs(eos.dRhoDT));
    // Isobaric ensemble: Var(V) = ⟨V⟩ T κ_T (e.g. Allen & Tildesley 2017, eq. 2.85), κ_T = (1/ρ)(∂ρ/∂P)_T from the EOS.
    const kappa = eos.dRhoDP / eos.reducedDensity;
    const expected = r.meanVolume * 1.0 * kappa;
    expect(Math.abs(r.volumeVariance - expected)).toBeLessThan(3 * r.volumeVarianceStdErr + 0.1 * expected);
    // The signs are physical: the liquid expands on heating and is compressed by pressure.
    expect(r.dRhoDT).toBeLessThan(0);
    expect(r.dRhoDP).toBeGreaterThan(0);
  });
});

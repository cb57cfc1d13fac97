import { describe, expect, it } from 'vitest';
import { schemeOfFit } from './scheme';

// Common practice, no source: B2 and dilute-gas viscosity are integrals over the whole pair potential, so
// parameters fitted to them describe the untruncated potential; simulation-fitted parameters belong to the
// cutoff treatment the simulations used.
describe('schemeOfFit', () => {
  it('is the full potential for fits without simulations', () => {
    expect(schemeOfFit({})).toEqual({ scheme: 'full-potential', cutoffSigma: null, cutoffOutOfRange: false });
    expect(schemeOfFit(null)).toEqual({ scheme: 'full-potential', cutoffSigma: null, cutoffOutOfRange: false });
  });

  it('inherits the simulations’ scheme and cutoff', () => {
    expect(schemeOfFit({ mdSettings: { scheme: 'truncated-tail', cutoff: 2.5 } })).toEqual({
      scheme: 'truncated-tail',
      cutoffSigma: 2.5,
      cutoffOutOfRange: false,
    });
    expect(schemeOfFit({ mdSettings: { scheme: 'truncated-shifted', cutoff: 3 } })).toEqual({
      scheme: 'truncated-shifted',
      cutoffSigma: 3,
      cutoffOutOfRange: false,
    });
  });

  it('flags a simulation cutoff outside 2.5–4 σ and ignores unknown schemes', () => {
    expect(schemeOfFit({ mdSettings: { scheme: 'truncated-tail', cutoff: 2 } }).cutoffOutOfRange).toBe(true);
    expect(schemeOfFit({ mdSettings: { scheme: 'something-else', cutoff: 3 } }).scheme).toBe('full-potential');
  });
});
